import { beforeEach, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { GET as submissions } from '@/app/api/tasting-table/submissions/route';
import { db } from '@/models';
import { resetDatabase } from '../support/db';
import { actAs } from '../support/session';
import { catalog, enrolledLearner } from '../support/practical-fixtures';

// The Tasting table's page query sorts on indexes (the status sort on the ENUM's declared order
// rather than FIELD()); these checks hold its order, paging and counts to what a plain sort of
// every row gives, for every sort.

type Row = { id: number; status: string; flagCount: number; submittedAt: string; learnerName: string; workshopId: number | null };
const get = async (query: string) => {
  const response = await submissions(new Request(`http://localhost:3000/api/tasting-table/submissions${query}`), {});
  expect(response.status).toBe(200);
  return (await response.json()) as { rows: Row[]; total: number; pageCount: number; counts: Record<string, number> };
};

let setting: Awaited<ReturnType<typeof catalog>>;
const STATUSES = ['approved', 'submitted', 'changes_requested'] as const;

beforeEach(async () => {
  await resetDatabase();
  setting = await catalog();
  const now = Date.now();
  // 45 submissions (three pages): names out of id order, statuses in a cycle that is not the ENUM's
  // order, 0 to 2 flags, ages that tie now and then (the id breaks ties), two workshops and none.
  for (let i = 0; i < 45; i++) {
    const workshopId = i % 3 === 0 ? null : setting.workshop.id;
    const { learner, enrollment } = await enrolledLearner(setting.flagship.id, 'active', workshopId, { quick: true });
    await db().User.update({ name: `Learner ${String((i * 17) % 45).padStart(2, '0')}` }, { where: { id: learner.id } });
    await db().Practical.create({
      enrollmentId: enrollment.id,
      userId: learner.id,
      round: 1,
      status: STATUSES[i % 3],
      details: { product: 'pickled-beets' },
      flags: [],
      flagCount: i % 4 === 0 ? 2 : i % 4 === 1 ? 1 : 0,
      submittedAt: new Date(now - Math.floor(i / 2) * 3_600_000),
    });
  }
  actAs(setting.instructor);
});

/** Every row, sorted in the database the simple way (no paging): the reference for each sort. */
async function reference(orderBy: string, where = '1 = 1') {
  return db().sequelize.query<{ id: number }>(
    `SELECT p.id FROM practicals p JOIN users u ON u.id = p.userId JOIN enrollments e ON e.id = p.enrollmentId WHERE ${where} ORDER BY ${orderBy}`,
    { type: QueryTypes.SELECT },
  );
}

async function allPages(query: string): Promise<Row[]> {
  const first = await get(`${query}&page=1`);
  const rows = [...first.rows];
  for (let page = 2; page <= first.pageCount; page++) rows.push(...(await get(`${query}&page=${page}`)).rows);
  return rows;
}

describe('Tasting table page query', () => {
  it.each([
    ['oldest', 'p.submittedAt ASC, p.id ASC'],
    ['newest', 'p.submittedAt DESC, p.id DESC'],
    ['learner', 'u.name ASC, p.submittedAt ASC, p.id ASC'],
    ['flags', 'p.flagCount DESC, p.submittedAt ASC, p.id ASC'],
    ['status', "FIELD(p.status, 'submitted', 'changes_requested', 'approved'), p.submittedAt ASC, p.id ASC"],
  ])('sort=%s pages through every row once, in the order of a plain sort', async (sort, orderBy) => {
    const rows = await allPages(`?sort=${sort}&status=all`);
    expect(rows).toHaveLength(45);
    expect(rows.map((r) => Number(r.id))).toEqual((await reference(orderBy)).map((r) => Number(r.id)));
  });

  it('keeps filters and sort together on deep pages and counts each status under the filters', async () => {
    const rows = await allPages(`?sort=status&status=all&flagged=yes&workshop=${setting.workshop.id}`);
    const expected = await reference(
      "FIELD(p.status, 'submitted', 'changes_requested', 'approved'), p.submittedAt ASC, p.id ASC",
      `p.flagCount > 0 AND e.workshopId = ${setting.workshop.id}`,
    );
    expect(rows.map((r) => Number(r.id))).toEqual(expected.map((r) => Number(r.id)));
    expect(rows.every((r) => r.flagCount > 0 && r.workshopId === setting.workshop.id)).toBe(true);
    const first = await get(`?sort=flags&status=submitted&flagged=yes&workshop=${setting.workshop.id}&page=1`);
    const counted = await db().sequelize.query<{ status: string; n: number }>(
      `SELECT p.status, COUNT(*) AS n FROM practicals p JOIN enrollments e ON e.id = p.enrollmentId WHERE p.flagCount > 0 AND e.workshopId = ${setting.workshop.id} GROUP BY p.status`,
      { type: QueryTypes.SELECT },
    );
    expect(first.counts).toEqual({ submitted: 0, changes_requested: 0, approved: 0, ...Object.fromEntries(counted.map((c) => [c.status, Number(c.n)])) });
    expect(first.total).toBe(first.counts.submitted);
    expect(first.rows.every((r) => r.status === 'submitted')).toBe(true);
    // A page past the end is empty, not an error.
    expect((await get('?sort=oldest&status=all&page=9')).rows).toEqual([]);
  }, 60_000);
});
