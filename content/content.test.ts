import { createElement, type ReactNode } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { getCourse, getCourses, getLessons } from '@/lib/content';
import { CALCULATOR_NAMES, componentsUsed, MDX_COMPONENT_NAMES } from '@/lib/content/component-names';
import { compileContent, type MdxComponents } from '@/lib/content/mdx';
import { countWords } from '@/lib/content/words';

// The lesson list of each course is the shared contract in the project brief.
const EXPECTED_LESSONS: Record<string, string[]> = {
  'pickling-and-canning': [
    'why-preserving-is-a-safety-job',
    'acidity',
    'salt-sugar-and-water',
    'preparing-produce-and-keeping-it-crisp',
    'jars-packing-and-headspace',
    'processing',
    'cooling-seals-storage-and-spoilage',
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
    expect(flagship).toMatchObject({ title: 'Safe Pickling and Water-Bath Canning', feeCents: 4500, currency: 'usd', passMarkPct: 80, workshopRequired: true, finalExam: 'pickling-and-canning--final-exam' });
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
  it('are exactly the lessons of the contract, in order', () => {
    for (const [course, slugs] of Object.entries(EXPECTED_LESSONS)) {
      expect(getLessons(course).map((l) => l.slug)).toEqual(slugs);
      expect(getLessons(course).map((l) => l.order)).toEqual(slugs.map((_, i) => i + 1));
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
