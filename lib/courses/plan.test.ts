import { describe, expect, it } from 'vitest';
import { describePlan, planCourseSync, type CourseFields, type CourseRow } from './plan';

const flagship: CourseFields = { slug: 'flagship', title: 'Flagship', feeCents: 4500, currency: 'usd', passMarkPct: 80, validityMonths: 36 };
const row = (fields: CourseFields, extra: Partial<CourseRow> = {}): CourseRow => ({ ...fields, id: 1, enrollments: 0, otherReferences: 0, ...extra });

describe('planCourseSync', () => {
  it('inserts a course the table lacks', () => {
    expect(planCourseSync([flagship], [])).toEqual({ insert: [flagship], update: [], remove: [], keep: [] });
  });

  it('updates only the fields that differ, naming old and new values', () => {
    const plan = planCourseSync([{ ...flagship, feeCents: 5000, title: 'Flagship, revised' }], [row(flagship)]);
    expect(plan.update).toEqual([
      {
        id: 1,
        slug: 'flagship',
        changes: [
          { field: 'title', from: 'Flagship', to: 'Flagship, revised' },
          { field: 'feeCents', from: 4500, to: 5000 },
        ],
      },
    ]);
    expect(describePlan(plan)).toEqual(['updated flagship: title Flagship -> Flagship, revised, feeCents 4500 -> 5000']);
  });

  it('leaves a row that matches its file alone', () => {
    expect(planCourseSync([flagship], [row(flagship)])).toEqual({ insert: [], update: [], remove: [], keep: [] });
  });

  it('never removes a course with enrollments or other rows pointing at it, and removes an unused one', () => {
    const plan = planCourseSync(
      [],
      [
        row({ ...flagship, slug: 'taught' }, { id: 2, enrollments: 3 }),
        row({ ...flagship, slug: 'planned' }, { id: 3, otherReferences: 1 }),
        row({ ...flagship, slug: 'unused' }, { id: 4 }),
      ],
    );
    expect(plan.keep.map((k) => k.slug)).toEqual(['taught', 'planned']);
    expect(plan.keep[0].reason).toBe('3 enrollment(s)');
    expect(plan.remove).toEqual([{ id: 4, slug: 'unused' }]);
  });
});
