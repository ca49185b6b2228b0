import 'server-only';
import { QueryTypes } from 'sequelize';
import { db } from '@/models';
import { loadStandings, type EnrollmentStanding } from '@/lib/certificates/facts';
import type { Check } from '@/lib/certificates/eligibility';
import type { DeskFilter, DeskQuery } from '@/lib/validations/certificate';
import { certificateState, type CertificateState } from '@/lib/certificates/validity';
import type { EnrollmentStatus } from '@/lib/enrollment-status';
import { getLesson } from '@/lib/content';
import { getBank } from '@/lib/quiz/bank';

export type DeskEnrollment = {
  id: number;
  learnerName: string;
  learnerEmail: string;
  courseSlug: string;
  courseTitle: string;
  workshop: { id: number; startsAt: string; place: string } | null;
  status: EnrollmentStatus;
  eligible: boolean;
  checks: Check[];
  certificate: {
    id: number;
    serial: string;
    issuedAt: string;
    validUntil: string;
    revokedAt: string | null;
    revokeReason: string | null;
    state: CertificateState;
  } | null;
};

export type DeskPage = { items: DeskEnrollment[]; total: number; page: number; pageSize: number; pages: number };

const CHUNK = 500;

/** Enrollment ids matching the SQL-side filters (course, workshop, status, search, certified), newest first. */
export async function matchingEnrollmentIds(filter: DeskFilter): Promise<number[]> {
  const where: string[] = [];
  const replacements: Record<string, unknown> = {};
  if (filter.course) {
    where.push('c.slug = :course');
    replacements.course = filter.course;
  }
  if (filter.workshop) {
    where.push('e.workshopId = :workshop');
    replacements.workshop = filter.workshop;
  }
  if (filter.status) {
    where.push('e.status = :status');
    replacements.status = filter.status;
  }
  if (filter.q) {
    where.push('(u.name LIKE :q OR u.email LIKE :q)');
    replacements.q = `%${filter.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
  }
  if (filter.eligible === 'certified') where.push('ce.id IS NOT NULL');
  if (filter.eligible === 'yes' || filter.eligible === 'no') where.push('ce.id IS NULL');
  // Raw SQL: ids only, filtered over four tables (LIKE on the learner, the certificate anti-join); the rows come from loadStandings.
  const rows = await db().sequelize.query<{ id: number }>(
    `SELECT e.id FROM enrollments e JOIN users u ON u.id = e.userId JOIN courses c ON c.id = e.courseId
       LEFT JOIN certificates ce ON ce.enrollmentId = e.id
      ${where.length ? `WHERE ${where.join(' AND ')}` : ''}
      ORDER BY e.createdAt DESC, e.id DESC`,
    { replacements, type: QueryTypes.SELECT },
  );
  return rows.map((r) => Number(r.id));
}

/** Standings for many ids, loaded in chunks so memory stays bounded, in the ids' order. */
export async function standingsInOrder(ids: readonly number[], now = new Date()): Promise<EnrollmentStanding[]> {
  const out: EnrollmentStanding[] = [];
  for (let i = 0; i < ids.length; i += CHUNK) {
    const chunk = ids.slice(i, i + CHUNK);
    const map = await loadStandings(chunk, { now });
    for (const id of chunk) {
      const s = map.get(id);
      if (s) out.push(s);
    }
  }
  return out;
}

/** Ids after every filter, eligibility included (eligibility is computed, so it filters in memory). */
export async function filteredIds(filter: DeskFilter, now = new Date()): Promise<number[]> {
  const ids = await matchingEnrollmentIds(filter);
  if (filter.eligible !== 'yes' && filter.eligible !== 'no') return ids;
  const want = filter.eligible === 'yes';
  return (await standingsInOrder(ids, now)).filter((s) => s.eligibility.eligible === want).map((s) => s.row.id);
}

/** A check whose missing lessons and quizzes are named by their titles, as the coordinator reads them. */
function titled(courseSlug: string, check: Check): Check {
  if (!check.missing?.length) return check;
  const title = (slug: string) => (check.key === 'lessons' ? getLesson(courseSlug, slug)?.title : getBank(slug)?.title) ?? slug;
  return { ...check, missing: check.missing.map(title) };
}

export function toDeskEnrollment(s: EnrollmentStanding, now = new Date()): DeskEnrollment {
  const { row } = s;
  return {
    id: row.id,
    learnerName: row.learnerName,
    learnerEmail: row.learnerEmail,
    courseSlug: row.courseSlug,
    courseTitle: row.courseTitle,
    workshop:
      row.workshopId && row.workshopStartsAt ? { id: row.workshopId, startsAt: row.workshopStartsAt.toISOString(), place: row.workshopPlace ?? '' } : null,
    status: row.status,
    eligible: s.eligibility.eligible && !row.certificate,
    checks: s.eligibility.checks.map((c) => titled(row.courseSlug, c)),
    certificate: row.certificate
      ? {
          id: row.certificate.id,
          serial: row.certificate.serial,
          issuedAt: row.certificate.issuedAt.toISOString(),
          validUntil: row.certificate.validUntil.toISOString(),
          revokedAt: row.certificate.revokedAt?.toISOString() ?? null,
          revokeReason: row.certificate.revokeReason,
          state: certificateState(row.certificate, now),
        }
      : null,
  };
}

/** One page of the desk's enrollment table. */
export async function fetchDeskPage(query: DeskQuery, now = new Date()): Promise<DeskPage> {
  const ids = await filteredIds(query, now);
  const pages = Math.max(1, Math.ceil(ids.length / query.pageSize));
  const page = Math.min(query.page, pages);
  const pageIds = ids.slice((page - 1) * query.pageSize, page * query.pageSize);
  const standings = await standingsInOrder(pageIds, now);
  return { items: standings.map((s) => toDeskEnrollment(s, now)), total: ids.length, page, pageSize: query.pageSize, pages };
}

export type DeskOptions = { courses: { slug: string; title: string }[]; workshops: { id: number; courseSlug: string; startsAt: string; place: string }[] };

/** The choices of the desk's filters. */
export async function fetchDeskOptions(): Promise<DeskOptions> {
  const { sequelize } = db();
  const [courses, workshops] = await Promise.all([
    // Raw SQL: two columns for a select list, no model instances.
    sequelize.query<{ slug: string; title: string }>('SELECT slug, title FROM courses ORDER BY id', { type: QueryTypes.SELECT }),
    // Raw SQL: a two-table join read as flat option rows.
    sequelize.query<{ id: number; courseSlug: string; startsAt: Date; place: string }>(
      'SELECT w.id, c.slug AS courseSlug, w.startsAt, w.place FROM workshops w JOIN courses c ON c.id = w.courseId ORDER BY w.startsAt DESC',
      { type: QueryTypes.SELECT },
    ),
  ]);
  return {
    courses,
    workshops: workshops.map((w) => ({ id: Number(w.id), courseSlug: w.courseSlug, startsAt: new Date(w.startsAt).toISOString(), place: w.place })),
  };
}
