import { describe, expect, it } from 'vitest';
import { lessonsForVersion, requirementText } from './versions';

const lessons = [{ slug: 'acidity', since: 1 }, { slug: 'processing' }, { slug: 'fermented-pickles-and-sauerkraut', since: 2 }];

describe('lessonsForVersion', () => {
  it('holds an enrollment begun under version 1 to the lessons of version 1 only', () => {
    expect(lessonsForVersion(lessons, 1).map((l) => l.slug)).toEqual(['acidity', 'processing']);
  });

  it('adds the lessons of later versions for enrollments begun under them', () => {
    expect(lessonsForVersion(lessons, 2).map((l) => l.slug)).toEqual(['acidity', 'processing', 'fermented-pickles-and-sauerkraut']);
    expect(lessonsForVersion(lessons, 3)).toHaveLength(3);
  });
});

describe('requirementText', () => {
  it('fills the lesson count in words, and in digits past twelve', () => {
    expect(requirementText('Read all {lessonCount} lessons.', 9)).toBe('Read all nine lessons.');
    expect(requirementText('Read all {lessonCount} lessons.', 14)).toBe('Read all 14 lessons.');
    expect(requirementText('Attend a workshop.', 9)).toBe('Attend a workshop.');
  });
});
