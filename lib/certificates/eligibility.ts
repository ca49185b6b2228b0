/**
 * The one rule deciding whether an enrollment may be certified, and why not. Pure: the caller
 * passes what the course requires (from the course content) and what the learner has done (from
 * the database, see `facts.ts`).
 */
export type CourseRequirements = {
  courseSlug: string;
  /** Every lesson slug of the course, in order. */
  lessonSlugs: readonly string[];
  /** The lesson quizzes of the course (each lesson's `quiz`), without the final exam. */
  quizSlugs: readonly string[];
  /** The final exam's quiz slug, or null when the course has none. */
  finalExam: string | null;
  /** Whether an instructor must approve a practical batch. */
  practicalRequired: boolean;
  /** Whether the course must be taken with a workshop (course front matter `workshopRequired`). */
  workshopRequired: boolean;
  /** Whether the learner must already hold a certificate this course refreshes. */
  priorCertificateRequired?: boolean;
};

export type EnrollmentFacts = {
  status: 'awaiting_payment' | 'active' | 'completed' | 'withdrawn';
  /** The fee the enrollment owes; 0 means a free course. */
  feeCents: number;
  /** A payment for this enrollment has status 'paid'. */
  paid: boolean;
  /** The enrollment used a fee waiver (enrollments.feeWaiverId). */
  waived: boolean;
  lessonsRead: readonly string[];
  /** Quiz slugs with at least one passed attempt, final exam included. */
  quizzesPassed: readonly string[];
  practicalApproved: boolean;
  workshopId: number | null;
  /** workshops.attendanceRequired of the enrollment's workshop (null without a workshop). */
  workshopAttendanceRequired: boolean | null;
  attended: boolean;
  /** An unrevoked certificate the course refreshes (only read when priorCertificateRequired). */
  hasPriorCertificate?: boolean;
  /** The learner has confirmed their e-mail address (users.emailVerifiedAt), so the certificate reaches its holder. */
  emailConfirmed: boolean;
};

export type RequirementKey = 'enrollment' | 'fee' | 'lessons' | 'quizzes' | 'final-exam' | 'practical' | 'workshop' | 'prior-certificate' | 'email';

export type Check = {
  key: RequirementKey;
  label: string;
  met: boolean;
  /** A short sentence for the checklist: what is done, or what is missing. */
  detail: string;
  /** The slugs still missing (lessons, quizzes); the desk names them by title (lib/desk/enrollments.ts). */
  missing?: string[];
};

export type Eligibility = { eligible: boolean; checks: Check[]; missing: RequirementKey[] };

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

export function checkEligibility(course: CourseRequirements, facts: EnrollmentFacts): Eligibility {
  const checks: Check[] = [];

  const usable = facts.status === 'active' || facts.status === 'completed';
  checks.push({
    key: 'enrollment',
    label: 'Enrollment in good standing',
    met: usable,
    detail: usable ? 'Active or completed.' : facts.status === 'withdrawn' ? 'The learner withdrew.' : 'The enrollment is still awaiting payment.',
  });

  const feeMet = facts.feeCents === 0 || facts.paid || facts.waived;
  checks.push({
    key: 'fee',
    label: 'Fee paid or waived',
    met: feeMet,
    detail: facts.waived ? 'Fee waived.' : facts.paid ? 'Fee paid.' : facts.feeCents === 0 ? 'No fee for this course.' : 'No paid payment and no waiver.',
  });

  const read = new Set(facts.lessonsRead);
  const unread = course.lessonSlugs.filter((s) => !read.has(s));
  checks.push({
    key: 'lessons',
    label: 'Every lesson read',
    met: unread.length === 0,
    detail: unread.length === 0 ? `All ${plural(course.lessonSlugs.length, 'lesson')} read.` : `${plural(unread.length, 'lesson')} not read yet.`,
    missing: unread,
  });

  const passed = new Set(facts.quizzesPassed);
  const lessonQuizzes = [...new Set(course.quizSlugs)].filter((q) => q !== course.finalExam);
  const failedQuizzes = lessonQuizzes.filter((q) => !passed.has(q));
  checks.push({
    key: 'quizzes',
    label: 'Every quiz passed',
    met: failedQuizzes.length === 0,
    detail:
      failedQuizzes.length === 0
        ? `All ${plural(lessonQuizzes.length, 'quiz', 'quizzes')} passed.`
        : `${plural(failedQuizzes.length, 'quiz', 'quizzes')} not passed yet.`,
    missing: failedQuizzes,
  });

  if (course.finalExam) {
    const met = passed.has(course.finalExam);
    checks.push({ key: 'final-exam', label: 'Final exam passed', met, detail: met ? 'Passed.' : 'Not passed yet.', missing: met ? [] : [course.finalExam] });
  }

  if (course.practicalRequired) {
    checks.push({
      key: 'practical',
      label: 'Practical batch passed the table',
      met: facts.practicalApproved,
      detail: facts.practicalApproved ? 'An instructor passed the practical batch.' : 'No practical batch has passed the table yet.',
    });
  }

  const attendanceNeeded = course.workshopRequired || (facts.workshopId !== null && facts.workshopAttendanceRequired === true);
  if (attendanceNeeded) {
    const met = facts.workshopId !== null && facts.attended;
    checks.push({
      key: 'workshop',
      label: 'Workshop attended',
      met,
      detail: met ? 'Attendance marked.' : facts.workshopId === null ? 'The course requires a workshop and none is chosen.' : 'Attendance not marked yet.',
    });
  }

  if (course.priorCertificateRequired) {
    const met = facts.hasPriorCertificate === true;
    checks.push({
      key: 'prior-certificate',
      label: 'Earlier certificate held',
      met,
      detail: met ? 'Holds a certificate this course refreshes.' : 'The refresher needs an earlier, unrevoked certificate.',
    });
  }

  // Someone else's address could otherwise be certified under a name they never chose.
  checks.push({
    key: 'email',
    label: 'E-mail address confirmed',
    met: facts.emailConfirmed,
    detail: facts.emailConfirmed ? 'Confirmed.' : 'The learner has not confirmed their e-mail address yet.',
  });

  const missing = checks.filter((c) => !c.met).map((c) => c.key);
  return { eligible: missing.length === 0, checks, missing };
}
