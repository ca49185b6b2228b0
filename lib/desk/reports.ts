import 'server-only';
import { QueryTypes } from 'sequelize';
import { db } from '@/models';
import { ENROLLMENT_STATUSES, type EnrollmentStatus } from '@/lib/enrollment-status';
import { isoDay } from '@/lib/local-time';

export type DeskReports = {
  byStatus: { status: EnrollmentStatus; count: number }[];
  workshops: { id: number; label: string; enrolled: number; completed: number; certified: number; completionPct: number }[];
  certificatesByMonth: { month: string; issued: number; revoked: number }[];
  fees: { month: string; currency: string; collectedCents: number; refundedCents: number }[];
  feeTotals: { currency: string; collectedCents: number; refundedCents: number; netCents: number }[];
};

/** Last `n` months as YYYY-MM, oldest first, ending with the month of `now` (UTC). */
export function lastMonths(n: number, now = new Date()): string[] {
  const out: string[] = [];
  for (let i = n - 1; i >= 0; i--) {
    const d = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - i, 1));
    out.push(`${d.getUTCFullYear()}-${String(d.getUTCMonth() + 1).padStart(2, '0')}`);
  }
  return out;
}

/**
 * The desk's report numbers. Completion rate of a workshop = enrollments completed ÷ enrollments
 * not withdrawn. Fees: "collected" counts payments that were paid (including those later
 * refunded), by the month they were paid; "refunded" counts refundedCents in the same month.
 */
export async function fetchDeskReports({ months = 12, now = new Date() }: { months?: number; now?: Date } = {}): Promise<DeskReports> {
  const { sequelize } = db();
  // Raw SQL: grouped counts and sums per status, workshop and month (DATE_FORMAT, GROUP BY), read as flat rows for the charts.
  const q = <T extends object>(sql: string, replacements: Record<string, unknown> = {}) => sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  const monthList = lastMonths(months, now);
  const since = new Date(`${monthList[0]}-01T00:00:00Z`);
  const [statusRows, workshopRows, issuedRows, revokedRows, feeRows] = await Promise.all([
    q<{ status: EnrollmentStatus; n: number }>('SELECT status, COUNT(*) AS n FROM enrollments GROUP BY status'),
    q<{ id: number; startsAt: Date; timeZone: string; place: string; title: string; enrolled: number; completed: number; certified: number }>(
      `SELECT w.id, w.startsAt, w.timeZone, w.place, c.title,
              SUM(e.id IS NOT NULL AND e.status <> 'withdrawn') AS enrolled,
              SUM(e.status = 'completed') AS completed,
              SUM(ce.id IS NOT NULL AND ce.revokedAt IS NULL) AS certified
         FROM workshops w JOIN courses c ON c.id = w.courseId
         LEFT JOIN enrollments e ON e.workshopId = w.id
         LEFT JOIN certificates ce ON ce.enrollmentId = e.id
        GROUP BY w.id, w.startsAt, w.timeZone, w.place, c.title
        ORDER BY w.startsAt`,
    ),
    q<{ month: string; n: number }>("SELECT DATE_FORMAT(issuedAt, '%Y-%m') AS month, COUNT(*) AS n FROM certificates WHERE issuedAt >= :since GROUP BY month", {
      since,
    }),
    q<{ month: string; n: number }>(
      "SELECT DATE_FORMAT(revokedAt, '%Y-%m') AS month, COUNT(*) AS n FROM certificates WHERE revokedAt >= :since GROUP BY month",
      { since },
    ),
    q<{ month: string; currency: string; collected: number; refunded: number }>(
      `SELECT DATE_FORMAT(paidAt, '%Y-%m') AS month, currency, SUM(amountCents) AS collected, SUM(refundedCents) AS refunded
         FROM payments WHERE paidAt IS NOT NULL AND status IN ('paid', 'refunded') AND paidAt >= :since
        GROUP BY month, currency`,
      { since },
    ),
  ]);
  const counts = new Map(statusRows.map((r) => [r.status, Number(r.n)]));
  const issued = new Map(issuedRows.map((r) => [r.month, Number(r.n)]));
  const revoked = new Map(revokedRows.map((r) => [r.month, Number(r.n)]));
  const currencies = [...new Set(feeRows.map((r) => r.currency))];
  if (currencies.length === 0) currencies.push('usd');
  const fees = monthList.flatMap((month) =>
    currencies.map((currency) => {
      const row = feeRows.find((r) => r.month === month && r.currency === currency);
      return { month, currency, collectedCents: Number(row?.collected ?? 0), refundedCents: Number(row?.refunded ?? 0) };
    }),
  );
  return {
    byStatus: ENROLLMENT_STATUSES.map((status) => ({ status, count: counts.get(status) ?? 0 })),
    workshops: workshopRows.map((w) => {
      const enrolled = Number(w.enrolled ?? 0);
      const completed = Number(w.completed ?? 0);
      // The workshop's date where it took place, not in UTC.
      const date = isoDay(w.startsAt, w.timeZone);
      return {
        id: Number(w.id),
        label: `${date} · ${w.place.split(',')[0]}`,
        enrolled,
        completed,
        certified: Number(w.certified ?? 0),
        completionPct: enrolled ? Math.round((completed / enrolled) * 1000) / 10 : 0,
      };
    }),
    certificatesByMonth: monthList.map((month) => ({ month, issued: issued.get(month) ?? 0, revoked: revoked.get(month) ?? 0 })),
    fees,
    feeTotals: currencies.map((currency) => {
      const rows = fees.filter((f) => f.currency === currency);
      const collectedCents = rows.reduce((s, r) => s + r.collectedCents, 0);
      const refundedCents = rows.reduce((s, r) => s + r.refundedCents, 0);
      return { currency, collectedCents, refundedCents, netCents: collectedCents - refundedCents };
    }),
  };
}
