import 'server-only';
import { formatShortDate } from '@/lib/local-time';
import { QueryTypes } from 'sequelize';
import { PRACTICAL_STATUSES, type PracticalStatus } from '@/models/practical';
import { db } from '@/models';
import { TASTING_PAGE_SIZE, type PracticalDetails, type TastingTableQuery } from '@/lib/validations/practical';
import type { Flag } from './checks';
import { photoUrl } from './service';

// Reads for the Tasting table, the submission page and the learner's practical page.

export type TastingRow = {
  id: number;
  round: number;
  status: PracticalStatus;
  flagCount: number;
  submittedAt: string;
  product: string | null;
  learnerName: string;
  courseSlug: string;
  workshopId: number | null;
  workshopStartsAt: string | null;
  workshopPlace: string | null;
  /** The workshop's own time zone, in which its date is shown. */
  workshopTimeZone: string | null;
};

export type TastingTablePage = {
  rows: TastingRow[];
  page: number;
  pageSize: number;
  total: number;
  pageCount: number;
  counts: Record<PracticalStatus, number>;
};

const ORDER: Record<TastingTableQuery['sort'], string> = {
  oldest: 'p.submittedAt ASC, p.id ASC',
  newest: 'p.submittedAt DESC, p.id DESC',
  learner: 'u.name ASC, p.submittedAt ASC, p.id ASC',
  flags: 'p.flagCount DESC, p.submittedAt ASC, p.id ASC',
  // The status column is ENUM('submitted', 'changes_requested', 'approved') (PRACTICAL_STATUSES):
  // an ENUM sorts by its declared order, waiting first, which an index can serve (FIELD() cannot).
  status: 'p.status ASC, p.submittedAt ASC, p.id ASC',
};

const iso = (d: unknown) => (d instanceof Date ? d.toISOString() : d === null || d === undefined ? null : String(d));

/**
 * One page of submissions for the Tasting table, with the count in each status under the same filters:
 * two queries run side by side, the page and one GROUP BY for the counts. The indexes of
 * migrations/20261202150000-tasting-table-indexes.js serve every filter and sort but the learner's
 * name from the index (the counts read the index only).
 */
export async function fetchTastingTable(query: TastingTableQuery, now = new Date()): Promise<TastingTablePage> {
  const { sequelize } = db();
  const where: string[] = [];
  const replacements: Record<string, unknown> = {};
  if (query.workshop) {
    where.push('e.workshopId = :workshop');
    replacements.workshop = query.workshop;
  }
  if (query.flagged === 'yes') where.push('p.flagCount > 0');
  if (query.flagged === 'no') where.push('p.flagCount = 0');
  if (query.olderThanDays !== undefined) {
    where.push('p.submittedAt <= :before');
    replacements.before = new Date(now.getTime() - query.olderThanDays * 86_400_000);
  }
  // The workshop filter is the only one that needs the enrollment; leave the join out otherwise.
  // With it, the walk starts at that workshop's enrollments (their workshop index) and goes on to
  // their practicals: STRAIGHT_JOIN keeps that order. On fresh statistics (right after a bulk load)
  // MariaDB 10.11 was seen choosing the other order, reading the workshop's enrollments again for
  // every practical: 626 ms instead of 2 ms for one page.
  const from = query.workshop ? 'enrollments e STRAIGHT_JOIN practicals p ON p.enrollmentId = e.id' : 'practicals p';
  const countsSql = `SELECT p.status, COUNT(*) AS n FROM ${from} ${where.length ? `WHERE ${where.join(' AND ')}` : ''} GROUP BY p.status`;
  const statusWhere = query.status === 'all' ? where : [...where, 'p.status = :status'];
  if (query.status !== 'all') replacements.status = query.status;
  const whereSql = statusWhere.length ? `WHERE ${statusWhere.join(' AND ')}` : '';
  const offset = (query.page - 1) * TASTING_PAGE_SIZE;

  // The page is found first by id alone (a "deferred join"): that walk reads only the index of the
  // sort and the tables a filter or the sort needs, so a far page (OFFSET in the thousands) or the
  // learner sort does not join and read every row it skips; the rest is joined for the page's rows.
  const pageJoin = query.sort === 'learner' ? 'JOIN users u ON u.id = p.userId' : '';
  const [rows, countRows] = await Promise.all([
    // Raw SQL: the deferred join, STRAIGHT_JOIN and the ENUM sort above are what keep a far page at 2 to 5 ms; Sequelize cannot emit them.
    sequelize.query<TastingRow>(
      `SELECT p.id, p.round, p.status, p.flagCount, p.submittedAt,
              JSON_UNQUOTE(JSON_EXTRACT(p.details, '$.product')) AS product,
              u.name AS learnerName, c.slug AS courseSlug,
              w.id AS workshopId, w.startsAt AS workshopStartsAt, w.place AS workshopPlace, w.timeZone AS workshopTimeZone
         FROM (SELECT p.id FROM ${from} ${pageJoin} ${whereSql}
                ORDER BY ${ORDER[query.sort]}
                LIMIT ${TASTING_PAGE_SIZE} OFFSET ${offset}) page
         JOIN practicals p ON p.id = page.id
         JOIN users u ON u.id = p.userId
         JOIN enrollments e ON e.id = p.enrollmentId
         JOIN courses c ON c.id = e.courseId
         LEFT JOIN workshops w ON w.id = e.workshopId
        ORDER BY ${ORDER[query.sort]}`,
      { replacements, type: QueryTypes.SELECT },
    ),
    // Raw SQL: the counts share the page's FROM and WHERE (STRAIGHT_JOIN included).
    sequelize.query<{ status: PracticalStatus; n: number | string }>(countsSql, { replacements, type: QueryTypes.SELECT }),
  ]);
  const counts = Object.fromEntries(PRACTICAL_STATUSES.map((s) => [s, 0])) as Record<PracticalStatus, number>;
  for (const row of countRows) counts[row.status] = Number(row.n);
  const total = query.status === 'all' ? Object.values(counts).reduce((a, b) => a + b, 0) : counts[query.status];
  return {
    rows: rows.map((r) => ({
      ...r,
      id: Number(r.id),
      round: Number(r.round),
      flagCount: Number(r.flagCount),
      submittedAt: iso(r.submittedAt)!,
      workshopId: r.workshopId === null ? null : Number(r.workshopId),
      workshopStartsAt: iso(r.workshopStartsAt),
    })),
    page: query.page,
    pageSize: TASTING_PAGE_SIZE,
    total,
    pageCount: Math.max(1, Math.ceil(total / TASTING_PAGE_SIZE)),
    counts,
  };
}

export type WorkshopOption = { id: number; label: string };

/** Workshops for the Tasting table's filter. */
export async function fetchWorkshopOptions(): Promise<WorkshopOption[]> {
  // Raw SQL: a two-table join read as flat option rows.
  const rows = await db().sequelize.query<{ id: number; startsAt: Date; timeZone: string; place: string; title: string }>(
    `SELECT w.id, w.startsAt, w.timeZone, w.place, c.title FROM workshops w JOIN courses c ON c.id = w.courseId ORDER BY w.startsAt DESC LIMIT 200`,
    { type: QueryTypes.SELECT },
  );
  return rows.map((w) => ({
    id: Number(w.id),
    label: `${formatShortDate(w.startsAt, w.timeZone)} · ${w.place.split(',')[0]}`,
  }));
}

export type RubricEntry = { verdict: 'met' | 'not_met'; comment: string };
export type ReviewView = {
  id: number;
  decision: 'approved' | 'changes_requested';
  rubric: Record<string, RubricEntry>;
  comment: string | null;
  reviewerName: string;
  createdAt: string;
};
export type PhotoView = { id: number; url: string; thumbnailUrl: string; width: number; height: number; caption: string | null };
export type RoundView = {
  id: number;
  round: number;
  status: PracticalStatus;
  /** Stored JSON: rows from seeders or older code may lack fields. */
  details: Partial<PracticalDetails>;
  flags: Flag[];
  submittedAt: string;
  photos: PhotoView[];
  reviews: ReviewView[];
};

async function roundsWhere(where: Record<string, unknown>): Promise<RoundView[]> {
  const { Practical, PracticalPhoto, Review, User } = db();
  const practicals = await Practical.findAll({
    where,
    order: [['round', 'DESC']],
    include: [
      { model: PracticalPhoto, as: 'photos' },
      { model: Review, as: 'reviews', include: [{ model: User, as: 'reviewer', attributes: ['name'] }] },
    ],
  });
  return practicals.map((p) => {
    const withIncludes = p as typeof p & {
      photos: InstanceType<typeof PracticalPhoto>[];
      reviews: (InstanceType<typeof Review> & { reviewer?: { name: string } })[];
    };
    return {
      id: p.id,
      round: p.round,
      status: p.status,
      details: (p.details ?? {}) as Partial<PracticalDetails>,
      flags: (p.flags ?? []) as unknown as Flag[],
      submittedAt: p.submittedAt.toISOString(),
      photos: [...withIncludes.photos]
        .sort((a, b) => a.id - b.id)
        .map((ph) => ({
          id: ph.id,
          url: photoUrl(ph.id),
          thumbnailUrl: photoUrl(ph.id, 'thumb'),
          width: ph.width,
          height: ph.height,
          caption: ph.caption ?? null,
        })),
      reviews: [...withIncludes.reviews]
        .sort((a, b) => a.id - b.id)
        .map((r) => ({
          id: r.id,
          decision: r.decision,
          rubric: r.rubric as Record<string, RubricEntry>,
          comment: r.comment ?? null,
          reviewerName: r.reviewer?.name ?? 'An instructor',
          createdAt: r.createdAt.toISOString(),
        })),
    };
  });
}

export type SubmissionView = {
  round: RoundView;
  earlierRounds: RoundView[];
  learner: { id: number; name: string; email: string };
  course: { slug: string; title: string };
  workshop: { id: number; startsAt: string; timeZone: string; place: string } | null;
  /** The instructor holding this round to decide on it, if any. */
  claim: { byId: number; byName: string } | null;
};

/** One submission for the Tasting table, with the earlier rounds of the same enrollment. */
export async function fetchSubmission({ id }: { id: number }): Promise<SubmissionView | null> {
  const { Practical, User, Enrollment, Course, Workshop } = db();
  const practical = await Practical.findByPk(id, { attributes: ['id', 'enrollmentId', 'userId', 'claimedById'] });
  if (!practical) return null;
  const [rounds, learner, enrollment, claimant] = await Promise.all([
    roundsWhere({ enrollmentId: practical.enrollmentId }),
    User.findByPk(practical.userId, { attributes: ['id', 'name', 'email'] }),
    Enrollment.findByPk(practical.enrollmentId),
    practical.claimedById ? User.findByPk(practical.claimedById, { attributes: ['id', 'name'] }) : null,
  ]);
  if (!learner || !enrollment) return null;
  const [course, workshop] = await Promise.all([Course.findByPk(enrollment.courseId), enrollment.workshopId ? Workshop.findByPk(enrollment.workshopId) : null]);
  if (!course) return null;
  const round = rounds.find((r) => r.id === id)!;
  return {
    round,
    earlierRounds: rounds.filter((r) => r.round < round.round),
    learner: { id: learner.id, name: learner.name, email: learner.email },
    course: { slug: course.slug, title: course.title },
    workshop: workshop ? { id: workshop.id, startsAt: workshop.startsAt.toISOString(), timeZone: workshop.timeZone, place: workshop.place } : null,
    claim: claimant ? { byId: claimant.id, byName: claimant.name } : null,
  };
}

/** Every round of a learner's practical in a course, newest first (for the practical page and the Pantry). */
export async function fetchLearnerPracticals({ userId, enrollmentId }: { userId: number; enrollmentId: number }): Promise<RoundView[]> {
  return roundsWhere({ userId, enrollmentId });
}

export type PracticalStatusSummary = {
  round: number;
  status: PracticalStatus;
  submittedAt: string;
  flagCount: number;
  review: { decision: 'approved' | 'changes_requested'; comment: string | null; reviewerName: string; createdAt: string } | null;
} | null;

/** Where the learner's practical in a course stands (the newest round and its review), for the status panel. */
export async function fetchPracticalStatus({ userId, enrollmentId }: { userId: number; enrollmentId: number }): Promise<PracticalStatusSummary> {
  return summarize(await roundsWhere({ userId, enrollmentId }));
}

export function summarize(rounds: RoundView[]): PracticalStatusSummary {
  const latest = rounds[0];
  if (!latest) return null;
  const review = latest.reviews[latest.reviews.length - 1];
  return {
    round: latest.round,
    status: latest.status,
    submittedAt: latest.submittedAt,
    flagCount: latest.flags.length,
    review: review ? { decision: review.decision, comment: review.comment, reviewerName: review.reviewerName, createdAt: review.createdAt } : null,
  };
}

/** The course's slug and title, or null. */
export async function fetchCourseHeading({ slug }: { slug: string }): Promise<{ id: number; slug: string; title: string } | null> {
  const course = await db().Course.findOne({ where: { slug }, attributes: ['id', 'slug', 'title'] });
  return course ? { id: course.id, slug: course.slug, title: course.title } : null;
}
