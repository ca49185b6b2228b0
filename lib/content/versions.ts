// Course content versions: an enrollment is held to the lessons in force when it began. Pure.

type Versioned = { since?: number };

/** The lessons required under a course content version (each lesson's `since` is the version that added it). */
export function lessonsForVersion<T extends Versioned>(lessons: readonly T[], version: number): T[] {
  return lessons.filter((lesson) => (lesson.since ?? 1) <= version);
}

const WORDS = ['zero', 'one', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight', 'nine', 'ten', 'eleven', 'twelve'];

/** A requirement line of the course front matter with `{lessonCount}` filled in from the content ("nine"). */
export function requirementText(text: string, lessonCount: number): string {
  return text.replaceAll('{lessonCount}', WORDS[lessonCount] ?? String(lessonCount));
}
