import Link from 'next/link';
import type { ComponentProps, ReactNode } from 'react';
import { cn } from '@/lib/cn';

// Styled elements for MDX output. Tailwind's reset strips headings, lists and tables of their
// look, so every element a lesson can produce is styled here rather than left to the browser.

type HeadingProps = ComponentProps<'h2'>;

function anchored(Tag: 'h2' | 'h3' | 'h4', className: string) {
  function Heading({ id, children, className: extra, ...rest }: HeadingProps) {
    return (
      <Tag id={id} className={cn('group scroll-mt-24 font-display text-brine-900', className, extra)} {...rest}>
        {id ? (
          <a href={`#${id}`} className="text-inherit no-underline hover:underline">
            {children}
          </a>
        ) : (
          children
        )}
      </Tag>
    );
  }
  Heading.displayName = `Mdx${Tag.toUpperCase()}`;
  return Heading;
}

export const H2 = anchored('h2', 'mt-10 mb-3 text-2xl font-bold leading-snug');
export const H3 = anchored('h3', 'mt-8 mb-2 text-xl font-bold leading-snug');
export const H4 = anchored('h4', 'mt-6 mb-2 text-lg font-bold');

/** Links inside the app go through next/link; links out open normally and say where they go. */
export function MdxLink({ href = '', children, className, ...rest }: ComponentProps<'a'>) {
  const classes = cn('text-brine-700 underline underline-offset-2 hover:text-brine-900', className);
  if (href.startsWith('/')) {
    return (
      <Link href={href} className={classes} {...rest}>
        {children}
      </Link>
    );
  }
  if (href.startsWith('#')) {
    return (
      <a href={href} className={classes} {...rest}>
        {children}
      </a>
    );
  }
  return (
    <a href={href} className={classes} rel="noopener noreferrer" {...rest}>
      {children}
    </a>
  );
}

export function MdxTable({ children, className, ...rest }: ComponentProps<'table'>) {
  return (
    <div className="my-6 overflow-x-auto rounded-lg border border-brine-100 bg-white" role="region" aria-label="Table" tabIndex={0}>
      <table className={cn('w-full border-collapse text-left text-sm', className)} {...rest}>
        {children}
      </table>
    </div>
  );
}

export const proseElements = {
  h1: anchored('h2', 'mt-10 mb-3 text-2xl font-bold leading-snug'),
  h2: H2,
  h3: H3,
  h4: H4,
  p: (props: ComponentProps<'p'>) => <p className="my-4 leading-relaxed" {...props} />,
  a: MdxLink,
  ul: (props: ComponentProps<'ul'>) => <ul className="my-4 list-disc space-y-1.5 pl-6 marker:text-brine-500" {...props} />,
  ol: (props: ComponentProps<'ol'>) => <ol className="my-4 list-decimal space-y-1.5 pl-6 marker:font-semibold marker:text-brine-700" {...props} />,
  li: (props: ComponentProps<'li'>) => <li className="pl-1 leading-relaxed" {...props} />,
  blockquote: (props: ComponentProps<'blockquote'>) => (
    <blockquote className="my-6 border-l-4 border-brine-300 bg-brine-50 py-2 pr-4 pl-4 italic text-ink-soft" {...props} />
  ),
  strong: (props: ComponentProps<'strong'>) => <strong className="font-semibold text-ink" {...props} />,
  em: (props: ComponentProps<'em'>) => <em className="italic" {...props} />,
  hr: (props: ComponentProps<'hr'>) => <hr className="my-8 border-brine-100" {...props} />,
  code: (props: ComponentProps<'code'>) => <code className="rounded bg-paper-deep px-1.5 py-0.5 font-mono text-[0.9em]" {...props} />,
  pre: (props: ComponentProps<'pre'>) => (
    <pre className="my-6 overflow-x-auto rounded-lg bg-ink p-4 text-sm text-paper [&_code]:bg-transparent [&_code]:p-0" {...props} />
  ),
  table: MdxTable,
  thead: (props: ComponentProps<'thead'>) => <thead className="bg-brine-50 text-brine-900" {...props} />,
  tbody: (props: ComponentProps<'tbody'>) => <tbody className="divide-y divide-brine-100" {...props} />,
  tr: (props: ComponentProps<'tr'>) => <tr className="align-top" {...props} />,
  th: (props: ComponentProps<'th'>) => <th scope="col" className="border-b border-brine-200 px-3 py-2 font-semibold" {...props} />,
  td: (props: ComponentProps<'td'>) => <td className="px-3 py-2" {...props} />,
  img: ({ alt = '', ...props }: ComponentProps<'img'>) => (
    // Lessons have no remote images; a local one keeps its alt text.
    // eslint-disable-next-line @next/next/no-img-element
    <img alt={alt} className="my-6 rounded-lg" {...props} />
  ),
};

/** A safety caution: where the work can hurt someone. */
export function Caution({ title = 'Caution', children }: { title?: string; children: ReactNode }) {
  return (
    <aside role="note" aria-label={title} data-callout="caution" className="my-6 rounded-jar border-l-4 border-beet-600 bg-beet-50 px-5 py-4">
      <p className="mb-1 flex items-center gap-2 font-display font-bold text-beet-700">
        <svg aria-hidden="true" viewBox="0 0 24 24" className="h-5 w-5 shrink-0" fill="none" stroke="currentColor" strokeWidth="2">
          <path d="M12 3 2 21h20L12 3Z" strokeLinejoin="round" />
          <path d="M12 10v5M12 18h.01" strokeLinecap="round" />
        </svg>
        {title}
      </p>
      <div className="text-ink [&>p]:my-2">{children}</div>
    </aside>
  );
}

/** A highlighted takeaway. */
export function KeyPoint({ title = 'Key point', children }: { title?: string; children: ReactNode }) {
  return (
    <aside role="note" aria-label={title} data-callout="key-point" className="my-6 rounded-jar border border-honey-500/40 bg-honey-50 px-5 py-4">
      <p className="mb-1 font-display text-sm font-bold tracking-wide text-honey-700 uppercase">{title}</p>
      <div className="text-ink [&>p]:my-2">{children}</div>
    </aside>
  );
}

/** A small citation line under the paragraph it supports. */
export function Source({ children }: { children: ReactNode }) {
  return (
    <div data-source className="my-3 border-l-2 border-brine-200 pl-3 text-sm text-ink-soft [&>p]:my-0 [&>p]:inline">
      <span className="font-semibold text-brine-800">Source: </span>
      {children}
    </div>
  );
}
