import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { ContentError, loadCourses, loadLessons } from './loader';
import { countWords } from './words';

const fixtures = (name: string) => path.join(__dirname, '__fixtures__', name);

function errorOf(fn: () => unknown): ContentError {
  try {
    fn();
  } catch (error) {
    if (error instanceof ContentError) return error;
    throw error;
  }
  throw new Error('expected a ContentError, nothing was thrown');
}

describe('content loader refuses malformed files with the file and the field', () => {
  it('objectives given as one string instead of a list', () => {
    const error = errorOf(() => loadLessons(fixtures('bad-objectives'), 'sample-course'));
    expect(error.file).toBe(path.join('bad-objectives', 'lessons', 'sample-course', '01-missing-objectives.mdx'));
    expect(error.field).toBe('objectives');
    expect(error.message).toContain('01-missing-objectives.mdx');
    expect(error.message).toContain('"objectives"');
  });

  it('a fee that is not a whole number of cents', () => {
    const error = errorOf(() => loadCourses(fixtures('bad-fee')));
    expect(error.message).toMatch(/typo-course\.mdx: front matter field "feeCents" is not valid/);
    expect(error.field).toBe('feeCents');
  });

  it('an order that disagrees with the NN- prefix of the file name', () => {
    const error = errorOf(() => loadLessons(fixtures('wrong-order'), 'sample-course'));
    expect(error.field).toBe('order');
    expect(error.message).toContain('03-numbered-three.mdx');
    expect(error.message).toContain('starts with 03');
  });

  it('an unknown (misspelt) field', () => {
    const error = errorOf(() => loadLessons(fixtures('unknown-field'), 'sample-course'));
    expect(error.message).toContain('01-typo.mdx');
    expect(error.message).toContain('previews');
  });

  it('front matter that is not YAML', () => {
    const error = errorOf(() => loadCourses(fixtures('bad-yaml')));
    expect(error.message).toContain('broken.mdx');
    expect(error.field).toBe('(front matter)');
  });

  it('an unknown course has no lessons rather than reading outside the content folder', () => {
    expect(loadLessons(fixtures('bad-objectives'), '../bad-objectives')).toEqual([]);
    expect(loadLessons(fixtures('bad-objectives'), 'no-such-course')).toEqual([]);
  });
});

describe('word count of lesson prose', () => {
  it('counts prose and leaves out components, code and markup', () => {
    const body = [
      '## Two words',
      '',
      'Vinegar of **5 percent** acidity, see [the guide](https://example.org/guide).',
      '',
      '<BrineCalculator defaultProduct="dilly-beans" />',
      '<Caution title="Hot glass">Let jars cool.</Caution>',
      '',
      '| a | b |',
      '| --- | --- |',
      '| one | two |',
      '',
      '```',
      'not counted at all',
      '```',
    ].join('\n');
    // Two words (2) + Vinegar of 5 percent acidity, see the guide (8) + Let jars cool (3) + a b one two (4)
    expect(countWords(body)).toBe(17);
  });
});
