import 'server-only';
import { createHash } from 'node:crypto';
import { compileMDX } from 'next-mdx-remote/rsc';
import type { ReactElement } from 'react';
import remarkGfm from 'remark-gfm';
import { rehypeHeadingIds, type TocEntry } from './headings';

export type MdxComponents = NonNullable<Parameters<typeof compileMDX>[0]['components']>;
export type CompiledContent = { content: ReactElement; toc: TocEntry[] };

// Compiled MDX per process: one entry per file, replaced when the file's text changes (its
// SHA-1 differs), so a page compiles a lesson once and then reuses the element tree.
const caches = new WeakMap<MdxComponents, Map<string, { hash: string; compiled: Promise<CompiledContent> }>>();
let compileRuns = 0;

/** How many times MDX was actually compiled in this process (for tests of the cache). */
export function mdxCompileRuns(): number {
  return compileRuns;
}

async function compile(file: string, body: string, components: MdxComponents): Promise<CompiledContent> {
  compileRuns += 1;
  const toc: TocEntry[] = [];
  try {
    const { content } = await compileMDX({
      source: body,
      components,
      options: { mdxOptions: { remarkPlugins: [remarkGfm], rehypePlugins: [rehypeHeadingIds(toc)] } },
    });
    return { content, toc };
  } catch (error) {
    throw new Error(`${file}: the MDX does not compile: ${(error as Error).message}`, { cause: error });
  }
}

/** The compiled body of a content file, from the cache when its text has not changed. */
export function compileContent({ file, body, components }: { file: string; body: string; components: MdxComponents }): Promise<CompiledContent> {
  let cache = caches.get(components);
  if (!cache) {
    cache = new Map();
    caches.set(components, cache);
  }
  const hash = createHash('sha1').update(body).digest('hex');
  const hit = cache.get(file);
  if (hit && hit.hash === hash) return hit.compiled;
  const compiled = compile(file, body, components);
  cache.set(file, { hash, compiled });
  compiled.catch(() => {
    if (cache.get(file)?.compiled === compiled) cache.delete(file);
  });
  return compiled;
}
