import type { TocEntry } from '@/lib/content/headings';
import { cn } from '@/lib/cn';

/** "In this lesson": the lesson's h2 and h3 headings, h3 nested under the h2 before it. */
export function TableOfContents({ entries, className }: { entries: TocEntry[]; className?: string }) {
  if (entries.length === 0) return null;
  const groups: { entry: TocEntry; children: TocEntry[] }[] = [];
  for (const entry of entries) {
    const last = groups[groups.length - 1];
    if (entry.depth === 3 && last) last.children.push(entry);
    else groups.push({ entry, children: [] });
  }
  return (
    // Named by aria-label rather than by the heading's id: a lesson page renders it twice (after the
    // title on narrow screens, in the side column on wide ones), and an id must be unique.
    <nav aria-label="In this lesson" data-lesson-nav className={cn('text-sm', className)}>
      <h2 className="mb-2 font-display text-sm font-bold tracking-wide text-brine-800 uppercase">In this lesson</h2>
      <ol className="space-y-1.5 border-l border-brine-100">
        {groups.map(({ entry, children }) => (
          <li key={entry.id}>
            <a
              href={`#${entry.id}`}
              className="-ml-px block border-l-2 border-transparent pl-3 text-ink-soft no-underline hover:border-brine-500 hover:text-brine-800"
            >
              {entry.text}
            </a>
            {children.length ? (
              <ol className="mt-1 space-y-1">
                {children.map((child) => (
                  <li key={child.id}>
                    <a href={`#${child.id}`} className="block pl-6 text-ink-soft no-underline hover:text-brine-800">
                      {child.text}
                    </a>
                  </li>
                ))}
              </ol>
            ) : null}
          </li>
        ))}
      </ol>
    </nav>
  );
}
