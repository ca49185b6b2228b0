import { createElement, type ReactNode } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { getChanges, getCourse, getCourses, getLessons } from '@/lib/content';
import { CALCULATOR_NAMES, componentsUsed, MDX_COMPONENT_NAMES } from '@/lib/content/component-names';
import { compileContent, type MdxComponents } from '@/lib/content/mdx';
import { countWords } from '@/lib/content/words';
import { lessonsForVersion, requirementText } from '@/lib/content/versions';
import { getBank } from '@/lib/quiz/bank';

// The lessons each course must have, in this order (the shared contract in the project brief and
// issue 16's fermenting lesson); a course may add others between them.
const EXPECTED_LESSONS: Record<string, string[]> = {
  'pickling-and-canning': [
    'why-preserving-is-a-safety-job',
    'acidity',
    'salt-sugar-and-water',
    'preparing-produce-and-keeping-it-crisp',
    'jars-packing-and-headspace',
    'processing',
    'cooling-seals-storage-and-spoilage',
    'fermented-pickles-and-sauerkraut',
    'the-practical-assessment',
  ],
  'volunteer-refresher': ['acid-and-ph-review', 'time-and-altitude-review'],
};

const allLessons = getCourses().flatMap((course) => getLessons(course.slug));

// Stand-ins that render their name, so the MDX of every lesson can be compiled and rendered here
// without the client calculators; an unknown component makes MDX throw while rendering.
const stub = (name: string) => {
  const Stub = ({ children }: { children?: ReactNode }) => createElement('div', { 'data-stub': name }, children);
  Stub.displayName = name;
  return Stub;
};
const stubs: MdxComponents = Object.fromEntries(MDX_COMPONENT_NAMES.map((name) => [name, stub(name)]));

describe('the courses', () => {
  it('has the flagship and the refresher with the fees of the program', () => {
    expect(getCourses().map((c) => c.slug)).toEqual(['pickling-and-canning', 'volunteer-refresher']);
    const flagship = getCourse('pickling-and-canning')!;
    expect(flagship).toMatchObject({
      title: 'Safe Pickling and Water-Bath Canning',
      feeCents: 4500,
      currency: 'usd',
      passMarkPct: 80,
      workshopRequired: true,
      finalExam: 'pickling-and-canning--final-exam',
    });
    const refresher = getCourse('volunteer-refresher')!;
    expect(refresher).toMatchObject({ title: 'Volunteer Refresher: Acid, Time and Altitude', feeCents: 1500, currency: 'usd', workshopRequired: false });
    expect(getCourse('no-such-course')).toBeNull();
  });

  it('each has an overview of real length and its requirements', () => {
    for (const course of getCourses()) {
      expect(countWords(course.body), course.file).toBeGreaterThan(250);
      expect(course.requirements.length, course.file).toBeGreaterThanOrEqual(2);
    }
  });
});

describe('the lessons', () => {
  it('include the lessons of the contract, in order, numbered 1 to n without gaps', () => {
    for (const [course, slugs] of Object.entries(EXPECTED_LESSONS)) {
      const actual = getLessons(course).map((l) => l.slug);
      expect(actual.filter((s) => slugs.includes(s))).toEqual(slugs);
      expect(getLessons(course).map((l) => l.order)).toEqual(actual.map((_, i) => i + 1));
    }
  });

  it('the first two flagship lessons are the public previews, and only they', () => {
    const previews = allLessons.filter((l) => l.preview).map((l) => `${l.courseSlug}/${l.slug}`);
    expect(previews).toEqual(['pickling-and-canning/why-preserving-is-a-safety-job', 'pickling-and-canning/acidity']);
  });

  it.each(allLessons.map((l) => [l.file, l] as const))('%s has 600+ words, objectives, a quiz and sources', (_file, lesson) => {
    expect(countWords(lesson.body)).toBeGreaterThanOrEqual(600);
    expect(lesson.objectives.length).toBeGreaterThanOrEqual(2);
    expect(lesson.quiz.startsWith(`${lesson.courseSlug}--`)).toBe(true);
    expect(lesson.sources.length).toBeGreaterThanOrEqual(1);
    for (const source of lesson.sources) {
      expect(source.title.length).toBeGreaterThan(3);
      expect(source.detail.length).toBeGreaterThan(3);
    }
  });

  it.each(allLessons.map((l) => [l.file, l] as const))('%s uses only the MDX components the site provides, and compiles', async (_file, lesson) => {
    for (const name of componentsUsed(lesson.body)) expect(MDX_COMPONENT_NAMES).toContain(name);
    const { content, toc } = await compileContent({ file: lesson.file, body: lesson.body, components: stubs });
    const html = renderToStaticMarkup(content);
    expect(toc.length).toBeGreaterThanOrEqual(2);
    for (const entry of toc) expect(html).toContain(`id="${entry.id}"`);
    for (const name of componentsUsed(lesson.body)) expect(html).toContain(`data-stub="${name}"`);
  });

  it('together embed every calculator at least once', () => {
    const used = new Set(allLessons.flatMap((l) => componentsUsed(l.body)));
    for (const name of CALCULATOR_NAMES) expect(used).toContain(name);
  });
});

// A safety number in a lesson: a temperature, a time, an altitude, a strength, a headspace, a pressure or a pH.
const SAFETY_NUMBER = /\d[\d,.]*(?:\/\d+)?\s*(?:°F|°C|minutes?\b|hours?\b|feet\b|percent\b|%|inch(?:es)?\b|pounds\b|psig\b)|pH \d/;
// A named source, or the honest label of a value without one (from memory, common practice, computed).
const NAMED_SOURCE =
  /USDA|Guide \d|the Guide|NIST|CFR|NCHFP|National Center for Home Food Preservation|Extension|IAPWS|Standard Atmosphere|CRC|IUPAC|FDA|Food Protection Trends|from memory|common practice|computed|<Source>/;

/** The paragraphs, lists and boxes of an MDX body (blocks between blank lines), headings left out. */
const blocksOf = (body: string) =>
  body
    .split(/\n\s*\n/)
    .map((b) => b.trim())
    .filter((b) => b && !b.startsWith('#'));

describe('the numbers in the lessons', () => {
  it.each(allLessons.map((l) => [l.file, l] as const))(
    '%s names a source (or says from memory, common practice or computed) beside every safety number',
    (_file, lesson) => {
      const blocks = blocksOf(lesson.body);
      const unsourced = blocks.filter(
        (block, i) => SAFETY_NUMBER.test(block) && !NAMED_SOURCE.test([blocks[i - 1] ?? '', block, blocks[i + 1] ?? ''].join('\n')),
      );
      expect(unsourced.map((b) => b.slice(0, 120))).toEqual([]);
    },
  );

  it('the check above fails on a number without a source', () => {
    const blocks = blocksOf('Intro text.\n\nProcess pints for 10 minutes.\n\nMore text.');
    expect(blocks.filter((b, i) => SAFETY_NUMBER.test(b) && !NAMED_SOURCE.test([blocks[i - 1] ?? '', b, blocks[i + 1] ?? ''].join('\n')))).toHaveLength(1);
  });

  // USDA Complete Guide to Home Canning, 2015 revision, Guide 3 (whole or halved tomatoes); the same doses
  // in Penn State Extension and University of Missouri Extension answers on acidifying tomatoes.
  it.each(allLessons.filter((l) => blocksOf(l.body).some((b) => /tomato/i.test(b) && /\d+, \d+, \d+ and\s+\d+/.test(b))).map((l) => [l.file, l] as const))(
    '%s gives the acid dose per jar wherever it gives tomato times',
    (_file, lesson) => {
      expect(lesson.body).toContain('1 tablespoon of bottled lemon juice or 1/4 teaspoon of citric acid per pint');
      expect(lesson.body).toContain('2 tablespoons of bottled lemon juice or 1/2 teaspoon of citric acid per quart');
    },
  );

  it('the tomato times appear somewhere, so the dose check above runs', () => {
    expect(allLessons.filter((l) => /tomato/i.test(l.body) && /40, 45, 50 and\s+55/.test(l.body)).length).toBeGreaterThan(0);
  });

  it('no lesson claims a home pH reading confirms the vinegar, or that the Guide stops at 10,000 feet', () => {
    for (const lesson of allLessons) {
      expect(lesson.body, lesson.file).not.toMatch(/did not use the wrong vinegar/);
      expect(lesson.body, lesson.file).not.toMatch(/altitude above 10,000 feet, it (tells|says)/);
      expect(lesson.body, lesson.file).not.toMatch(/kosher salt\*\* are pure/);
    }
  });

  it('the Guide figures the review asked for are given as numbers with their source', () => {
    const text = (slug: string) => allLessons.find((l) => l.slug === slug)!.body;
    // USDA Complete Guide to Home Canning, 2015 revision, Guide 1.
    expect(text('jars-packing-and-headspace')).toMatch(/boil them for 10 minutes at up to 1,000 feet, adding 1 minute for each further 1,000 feet/);
    expect(text('processing')).toMatch(/140 °F for a raw pack\*\* and to \*\*180 °F for a hot pack/);
    expect(text('processing')).toMatch(/wait 5 minutes/);
    expect(text('why-preserving-is-a-safety-job')).toMatch(/40 and 120 °F/);
    expect(text('cooling-seals-storage-and-spoilage')).toMatch(/1 part unscented liquid household chlorine bleach .* to 5 parts clean water/);
    expect(text('cooling-seals-storage-and-spoilage')).toMatch(/surface scum and mould are removed regularly/);
    // USDA Complete Guide, Guide 6: hard water boiled and left to settle.
    expect(text('salt-sugar-and-water')).toMatch(/boil the hard water for 15 minutes, let it stand covered for 24 hours/);
    // NCHFP, Using Atmospheric Steam Canners: 45 minutes or less including the altitude adjustment.
    expect(text('processing')).toMatch(/45 minutes or less/);
    for (const method of ['Open-kettle', 'Jar inversion', 'Oven canning', 'Canning powders', 'Paraffin', 'Electric multicookers', 'atmospheric steam canner']) {
      expect(text('processing')).toContain(method);
    }
  });
});

describe('the fermenting lesson', () => {
  const lesson = getLessons('pickling-and-canning').find((l) => l.slug === 'fermented-pickles-and-sauerkraut')!;

  it('is a full lesson of 1,000+ words that embeds the salt calculator where it teaches brine strength', () => {
    expect(countWords(lesson.body)).toBeGreaterThanOrEqual(1000);
    expect(componentsUsed(lesson.body)).toContain('SaltCalculator');
    const brineSection = lesson.body.slice(lesson.body.indexOf('## Salt by weight'), lesson.body.indexOf('## Keep everything'));
    expect(brineSection).toContain('<SaltCalculator');
    for (const topic of [
      '## Keep everything under the brine',
      '## Temperature and time',
      'cool, slow option',
      '## Scum, mould and when to discard',
      '## Refrigerate or can',
      'heat it slowly to a boil',
    ]) {
      expect(lesson.body).toContain(topic);
    }
  });

  it('has a quiz of 6 to 8 questions that the final exam draws from', () => {
    const bank = getBank(lesson.quiz)!;
    expect(bank.questions.length).toBeGreaterThanOrEqual(6);
    expect(bank.questions.length).toBeLessThanOrEqual(8);
    const exam = getBank('pickling-and-canning--final-exam')!;
    const ids = new Set(exam.questions.map((q) => q.id));
    for (const q of bank.questions) expect(ids).toContain(q.id);
  });
});

describe('course content versions', () => {
  it('the fermenting lesson arrived with version 2; every other lesson is required from version 1', () => {
    const flagship = getCourse('pickling-and-canning')!;
    expect(flagship.version).toBe(2);
    const lessons = getLessons('pickling-and-canning');
    expect(lessonsForVersion(lessons, 1)).toHaveLength(8);
    expect(lessonsForVersion(lessons, 2)).toHaveLength(9);
    expect(lessons.filter((l) => l.since > 1).map((l) => l.slug)).toEqual(['fermented-pickles-and-sauerkraut']);
    for (const course of getCourses()) for (const l of getLessons(course.slug)) expect(l.since, l.file).toBeLessThanOrEqual(course.version);
  });

  it('the course page states the current lesson count from the content', () => {
    const flagship = getCourse('pickling-and-canning')!;
    const lines = flagship.requirements.map((r) => requirementText(r, getLessons(flagship.slug).length));
    expect(lines[0]).toBe('Read all nine lessons and pass each lesson quiz.');
    for (const course of getCourses()) expect(course.requirements.join(' '), course.file).not.toMatch(/\b(eight|seven|ten) lessons\b/);
  });
});

describe('what changed, per course', () => {
  it.each(getCourses().map((c) => [c.slug] as const))('%s has a dated record whose entries name a source and a lesson of the course', (slug) => {
    const record = getChanges(slug)!;
    expect(record, slug).not.toBeNull();
    expect(record.changes.length).toBeGreaterThan(0);
    const lessons = new Set(getLessons(slug).map((l) => l.slug));
    for (const change of record.changes) {
      expect(change.source.length, change.id).toBeGreaterThan(10);
      expect(NAMED_SOURCE.test(change.source), change.id).toBe(true);
      if (change.lesson) expect(lessons, change.id).toContain(change.lesson);
    }
    const dates = record.changes.map((c) => c.date);
    expect(dates).toEqual([...dates].sort().reverse());
  });

  it('change ids are unique across courses (each is e-mailed once by its id)', () => {
    const ids = getCourses().flatMap((c) => getChanges(c.slug)?.changes.map((x) => x.id) ?? []);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it('announces the fermenting lesson', () => {
    expect(getChanges('pickling-and-canning')!.changes.some((c) => c.kind === 'lesson' && c.lesson === 'fermented-pickles-and-sauerkraut')).toBe(true);
  });
});
