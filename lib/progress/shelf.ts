// The Pantry's shelves, computed from the course content and the learner's progress. Pure.

export type ShelfLessonInput = { slug: string; title: string; order: number; quiz: string };
export type ShelfCourseInput = {
  slug: string;
  title: string;
  status: 'awaiting_payment' | 'active' | 'completed' | 'withdrawn';
  finalExam?: string | null;
  lessons: ShelfLessonInput[];
  read: Record<string, string>;
  passedQuizzes: string[];
  /** Requirements beyond the jars still missing, in plain words ("practical batch", "workshop"); unknown when absent. */
  remaining?: string[];
};

export type Jar = {
  lessonSlug: string;
  title: string;
  order: number;
  quizSlug: string;
  read: boolean;
  quizPassed: boolean;
  /** 0 empty, 0.5 half (read or quiz passed), 1 full (both). */
  fill: 0 | 0.5 | 1;
  label: string;
};

export type NextStep = { label: string; href: string } | null;

export type Shelf = {
  courseSlug: string;
  title: string;
  status: ShelfCourseInput['status'];
  jars: Jar[];
  finalExam: { quizSlug: string; passed: boolean } | null;
  filled: number;
  next: NextStep;
};

/** The plain name of each requirement beyond the jars, for "Still to do: …". */
export const STILL_TO_DO = {
  fee: 'course fee',
  practical: 'practical batch',
  workshop: 'workshop',
  'prior-certificate': 'an earlier certificate',
} as const;

/** The accessible name of a jar, e.g. "Acidity: read, quiz passed". */
export function jarLabel(title: string, read: boolean, quizPassed: boolean): string {
  return `${title}: ${read ? 'read' : 'not read yet'}, ${quizPassed ? 'quiz passed' : 'quiz not passed yet'}`;
}

export function buildShelf(input: ShelfCourseInput): Shelf {
  const passed = new Set(input.passedQuizzes);
  const jars = [...input.lessons]
    .sort((a, b) => a.order - b.order)
    .map((l): Jar => {
      const read = Boolean(input.read[l.slug]);
      const quizPassed = passed.has(l.quiz);
      return {
        lessonSlug: l.slug,
        title: l.title,
        order: l.order,
        quizSlug: l.quiz,
        read,
        quizPassed,
        fill: read && quizPassed ? 1 : read || quizPassed ? 0.5 : 0,
        label: jarLabel(l.title, read, quizPassed),
      };
    });
  const lessonQuizzes = new Set(jars.map((j) => j.quizSlug));
  const finalExam = input.finalExam && !lessonQuizzes.has(input.finalExam) ? { quizSlug: input.finalExam, passed: passed.has(input.finalExam) } : null;
  return {
    courseSlug: input.slug,
    title: input.title,
    status: input.status,
    jars,
    finalExam,
    filled: jars.filter((j) => j.fill === 1).length,
    next: nextStep(input, jars, finalExam),
  };
}

function nextStep(input: ShelfCourseInput, jars: Jar[], finalExam: Shelf['finalExam']): NextStep {
  const course = `/courses/${input.slug}`;
  if (input.status === 'awaiting_payment') return { label: 'Finish paying the course fee to open the lessons', href: course };
  if (input.status === 'withdrawn') return { label: 'You withdrew from this course. See the course to enroll again', href: course };
  const unread = jars.find((j) => !j.read);
  const unpassed = jars.find((j) => !j.quizPassed);
  // The earlier of: the first lesson not read, the first quiz not passed.
  const first = [unread, unpassed].filter((j): j is Jar => Boolean(j)).sort((a, b) => a.order - b.order)[0];
  if (first && !first.read) return { label: `Read lesson ${first.order}: ${first.title}`, href: `/learn/${input.slug}/${first.lessonSlug}` };
  if (first) return { label: `Take the quiz for lesson ${first.order}: ${first.title}`, href: `/quiz/${first.quizSlug}` };
  if (finalExam && !finalExam.passed) return { label: 'Take the final exam', href: `/quiz/${finalExam.quizSlug}` };
  const remaining = input.remaining ?? [];
  if (remaining.length === 0) return { label: 'Every jar is full and every requirement is met. See the course', href: course };
  const href = remaining.includes(STILL_TO_DO.practical) ? `/learn/${input.slug}/practical` : course;
  return { label: `Every jar is full. Still to do: ${remaining.join(', ')}`, href };
}
