import { createElement, type ReactNode } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { slugify } from './headings';
import { compileContent, mdxCompileRuns, type MdxComponents } from './mdx';

const components: MdxComponents = {
  KeyPoint: ({ children }: { children?: ReactNode }) => createElement('aside', { 'data-key-point': '' }, children),
};

const body = [
  '## Why acid matters',
  '',
  'Some text with a [link](/bench).',
  '',
  '### The pH 4.6 line',
  '',
  '<KeyPoint>Keep the acid.</KeyPoint>',
  '',
  '## Why acid matters',
  '',
  '| Jar | Minutes |',
  '| --- | --- |',
  '| Pint | 10 |',
].join('\n');

describe('compiled MDX', () => {
  it('gives headings unique ids and lists them in the table of contents', async () => {
    const { content, toc } = await compileContent({ file: 'test/one.mdx', body, components });
    expect(toc).toEqual([
      { id: 'why-acid-matters', text: 'Why acid matters', depth: 2 },
      { id: 'the-ph-4-6-line', text: 'The pH 4.6 line', depth: 3 },
      { id: 'why-acid-matters-2', text: 'Why acid matters', depth: 2 },
    ]);
    const html = renderToStaticMarkup(content);
    expect(html).toContain('<h2 id="why-acid-matters">');
    expect(html).toContain('<h3 id="the-ph-4-6-line">');
    expect(html).toContain('<h2 id="why-acid-matters-2">');
    expect(html).toContain('<aside data-key-point="">Keep the acid.</aside>');
    // GitHub-style tables (remark-gfm) become real tables.
    expect(html).toMatch(/<table>.*<th>Jar<\/th>.*<td>10<\/td>/s);
  });

  it('compiles a file once per process and again only when its text changes', async () => {
    const before = mdxCompileRuns();
    const first = await compileContent({ file: 'test/cached.mdx', body: '## One\n\nText.', components });
    const again = await compileContent({ file: 'test/cached.mdx', body: '## One\n\nText.', components });
    expect(again).toBe(first);
    expect(mdxCompileRuns()).toBe(before + 1);
    const changed = await compileContent({ file: 'test/cached.mdx', body: '## Two\n\nText.', components });
    expect(changed.toc[0].id).toBe('two');
    expect(mdxCompileRuns()).toBe(before + 2);
  });

  it('names the file when the MDX does not compile, and does not cache the failure', async () => {
    await expect(compileContent({ file: 'test/broken.mdx', body: '<KeyPoint>never closed', components })).rejects.toThrow(
      /^test\/broken\.mdx: the MDX does not compile/,
    );
    const runs = mdxCompileRuns();
    await expect(compileContent({ file: 'test/broken.mdx', body: '<KeyPoint>never closed', components })).rejects.toThrow(/broken\.mdx/);
    expect(mdxCompileRuns()).toBe(runs + 1);
  });
});

describe('slugify', () => {
  it('makes readable ids', () => {
    expect(slugify('Salt, sugar & water')).toBe('salt-sugar-and-water');
    expect(slugify('Crème fraîche?')).toBe('creme-fraiche');
    expect(slugify('!!!')).toBe('section');
  });
});
