import { describe, expect, it } from 'vitest';
import { requirementsFromContent } from './catalog';
import { checkEligibility, type CourseRequirements, type EnrollmentFacts } from './eligibility';

const course: CourseRequirements = {
  courseSlug: 'pickling-and-canning',
  lessonSlugs: ['acidity', 'processing'],
  quizSlugs: ['pickling-and-canning--acidity', 'pickling-and-canning--processing'],
  finalExam: 'pickling-and-canning--final-exam',
  practicalRequired: true,
  workshopRequired: true,
};

const done: EnrollmentFacts = {
  status: 'active',
  feeCents: 4500,
  paid: true,
  waived: false,
  lessonsRead: ['acidity', 'processing'],
  quizzesPassed: ['pickling-and-canning--acidity', 'pickling-and-canning--processing', 'pickling-and-canning--final-exam'],
  practicalApproved: true,
  workshopId: 7,
  workshopAttendanceRequired: true,
  attended: true,
  emailConfirmed: true,
};

describe('checkEligibility', () => {
  it('is eligible when everything is done, with every check met', () => {
    const result = checkEligibility(course, done);
    expect(result.eligible).toBe(true);
    expect(result.missing).toEqual([]);
    expect(result.checks.map((c) => c.key)).toEqual(['enrollment', 'fee', 'lessons', 'quizzes', 'final-exam', 'practical', 'workshop', 'email']);
  });

  it('accepts a waiver instead of a payment, and a free course with neither', () => {
    expect(checkEligibility(course, { ...done, paid: false, waived: true }).eligible).toBe(true);
    expect(checkEligibility(course, { ...done, paid: false, feeCents: 0 }).eligible).toBe(true);
  });

  it('misses the fee when neither paid nor waived', () => {
    const result = checkEligibility(course, { ...done, paid: false });
    expect(result.eligible).toBe(false);
    expect(result.missing).toEqual(['fee']);
  });

  it('names each unread lesson', () => {
    const result = checkEligibility(course, { ...done, lessonsRead: ['acidity'] });
    expect(result.missing).toEqual(['lessons']);
    expect(result.checks.find((c) => c.key === 'lessons')).toMatchObject({ met: false, missing: ['processing'], detail: '1 lesson not read yet.' });
  });

  it('ignores progress on lessons that are not in the course', () => {
    expect(checkEligibility(course, { ...done, lessonsRead: ['acidity', 'other-course-lesson'] }).missing).toEqual(['lessons']);
  });

  it('names each quiz not passed', () => {
    const result = checkEligibility(course, { ...done, quizzesPassed: ['pickling-and-canning--final-exam'] });
    expect(result.missing).toEqual(['quizzes']);
    expect(result.checks.find((c) => c.key === 'quizzes')?.missing).toEqual(['pickling-and-canning--acidity', 'pickling-and-canning--processing']);
  });

  it('misses the final exam on its own', () => {
    const result = checkEligibility(course, { ...done, quizzesPassed: ['pickling-and-canning--acidity', 'pickling-and-canning--processing'] });
    expect(result.missing).toEqual(['final-exam']);
  });

  it('misses the practical when not approved, and skips it for a course without one', () => {
    expect(checkEligibility(course, { ...done, practicalApproved: false }).missing).toEqual(['practical']);
    expect(checkEligibility({ ...course, practicalRequired: false }, { ...done, practicalApproved: false }).eligible).toBe(true);
  });

  it('misses workshop attendance when not marked, or when the course requires a workshop and none is chosen', () => {
    expect(checkEligibility(course, { ...done, attended: false }).missing).toEqual(['workshop']);
    const none = checkEligibility(course, { ...done, workshopId: null, workshopAttendanceRequired: null, attended: false });
    expect(none.missing).toEqual(['workshop']);
    expect(none.checks.find((c) => c.key === 'workshop')?.detail).toMatch(/none is chosen/);
  });

  it('asks for attendance only where the course or the workshop requires it', () => {
    const optional = { ...course, workshopRequired: false };
    expect(checkEligibility(optional, { ...done, attended: false, workshopAttendanceRequired: false }).eligible).toBe(true);
    expect(checkEligibility(optional, { ...done, attended: false, workshopAttendanceRequired: true }).missing).toEqual(['workshop']);
    expect(checkEligibility(optional, { ...done, workshopId: null, workshopAttendanceRequired: null, attended: false }).eligible).toBe(true);
  });

  it('refuses withdrawn enrollments and ones awaiting payment', () => {
    expect(checkEligibility(course, { ...done, status: 'withdrawn' }).missing).toEqual(['enrollment']);
    expect(checkEligibility(course, { ...done, status: 'awaiting_payment', paid: false }).missing).toEqual(['enrollment', 'fee']);
  });

  it('requires an earlier certificate for the refresher', () => {
    const refresher = requirementsFromContent({ slug: 'volunteer-refresher', finalExam: 'volunteer-refresher--quiz', workshopRequired: false }, [
      { slug: 'acid-and-ph-review', quiz: 'volunteer-refresher--quiz' },
      { slug: 'time-and-altitude-review', quiz: 'volunteer-refresher--quiz' },
    ]);
    const facts: EnrollmentFacts = {
      ...done,
      lessonsRead: ['acid-and-ph-review', 'time-and-altitude-review'],
      quizzesPassed: ['volunteer-refresher--quiz'],
      practicalApproved: false,
      workshopId: null,
      workshopAttendanceRequired: null,
      attended: false,
    };
    expect(checkEligibility(refresher, { ...facts, hasPriorCertificate: true }).eligible).toBe(true);
    expect(checkEligibility(refresher, { ...facts, hasPriorCertificate: false }).missing).toEqual(['prior-certificate']);
  });

  it('lists every missing requirement at once', () => {
    const nothing: EnrollmentFacts = { ...done, paid: false, lessonsRead: [], quizzesPassed: [], practicalApproved: false, attended: false };
    expect(checkEligibility(course, nothing).missing).toEqual(['fee', 'lessons', 'quizzes', 'final-exam', 'practical', 'workshop']);
  });

  it('refuses an unconfirmed e-mail address, whatever else is done', () => {
    const result = checkEligibility(course, { ...done, emailConfirmed: false });
    expect(result.missing).toEqual(['email']);
    expect(result.checks.find((c) => c.key === 'email')?.detail).toBe('The learner has not confirmed their e-mail address yet.');
  });
});

describe('requirementsFromContent', () => {
  it('takes each lesson quiz once and keeps the final exam apart', () => {
    const r = requirementsFromContent({ slug: 'volunteer-refresher', finalExam: null, workshopRequired: false }, [
      { slug: 'acid-and-ph-review', quiz: 'volunteer-refresher--quiz' },
      { slug: 'time-and-altitude-review', quiz: 'volunteer-refresher--quiz' },
    ]);
    expect(r).toMatchObject({
      lessonSlugs: ['acid-and-ph-review', 'time-and-altitude-review'],
      quizSlugs: ['volunteer-refresher--quiz'],
      finalExam: null,
      practicalRequired: false,
      priorCertificateRequired: true,
    });
    const f = requirementsFromContent({ slug: 'pickling-and-canning', finalExam: 'pickling-and-canning--final-exam', workshopRequired: true }, [
      { slug: 'acidity', quiz: 'pickling-and-canning--acidity' },
    ]);
    expect(f).toMatchObject({
      quizSlugs: ['pickling-and-canning--acidity'],
      finalExam: 'pickling-and-canning--final-exam',
      practicalRequired: true,
      workshopRequired: true,
    });
  });
});
