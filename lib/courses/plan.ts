// The course sync's decisions, kept pure: content/courses/ is the source of these fields, the
// `courses` table holds a copy for joins and foreign keys.

export const SYNCED_FIELDS = ['title', 'feeCents', 'currency', 'passMarkPct', 'validityMonths'] as const;
export type SyncedField = (typeof SYNCED_FIELDS)[number];

export type CourseFields = { slug: string; title: string; feeCents: number; currency: string; passMarkPct: number; validityMonths: number };
/** A `courses` row with how many rows of other tables point at it. */
export type CourseRow = CourseFields & { id: number; enrollments: number; otherReferences: number };

export type FieldChange = { field: SyncedField; from: string | number; to: string | number };
export type SyncPlan = {
  insert: CourseFields[];
  update: { id: number; slug: string; changes: FieldChange[] }[];
  remove: { id: number; slug: string }[];
  /** Gone from content/courses/ but still referenced, so the row stays. */
  keep: { id: number; slug: string; reason: string }[];
};

export function planCourseSync(content: readonly CourseFields[], rows: readonly CourseRow[]): SyncPlan {
  const bySlug = new Map(rows.map((row) => [row.slug, row]));
  const inContent = new Set(content.map((course) => course.slug));
  const plan: SyncPlan = { insert: [], update: [], remove: [], keep: [] };
  for (const course of content) {
    const row = bySlug.get(course.slug);
    if (!row) {
      plan.insert.push(pick(course));
      continue;
    }
    const changes = SYNCED_FIELDS.filter((field) => row[field] !== course[field]).map((field) => ({ field, from: row[field], to: course[field] }));
    if (changes.length) plan.update.push({ id: row.id, slug: row.slug, changes });
  }
  for (const row of rows) {
    if (inContent.has(row.slug)) continue;
    if (row.enrollments > 0) plan.keep.push({ id: row.id, slug: row.slug, reason: `${row.enrollments} enrollment(s)` });
    else if (row.otherReferences > 0) plan.keep.push({ id: row.id, slug: row.slug, reason: `${row.otherReferences} workshop, waiver or settings row(s)` });
    else plan.remove.push({ id: row.id, slug: row.slug });
  }
  return plan;
}

const pick = (c: CourseFields): CourseFields => ({
  slug: c.slug,
  title: c.title,
  feeCents: c.feeCents,
  currency: c.currency,
  passMarkPct: c.passMarkPct,
  validityMonths: c.validityMonths,
});

/** One line per change, for the migrate command's output and the server log. */
export function describePlan(plan: SyncPlan): string[] {
  return [
    ...plan.insert.map((c) => `added ${c.slug} (${c.title}, ${c.feeCents} ${c.currency} cents)`),
    ...plan.update.map((u) => `updated ${u.slug}: ${u.changes.map((c) => `${c.field} ${c.from} -> ${c.to}`).join(', ')}`),
    ...plan.remove.map((r) => `removed ${r.slug} (no longer in content/courses/, nothing refers to it)`),
    ...plan.keep.map((k) => `kept ${k.slug} (no longer in content/courses/, but it has ${k.reason})`),
  ];
}
