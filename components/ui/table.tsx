import { useId, type ComponentProps, type ReactNode } from 'react';
import { cn } from '@/lib/cn';

/**
 * A table that scrolls sideways inside its own box on a narrow screen, never the page: the box is a
 * region named by the caption and reachable by keyboard, so it can be scrolled without a mouse.
 * It is `relative` so that visually hidden labels inside (absolutely placed) stay in the box too.
 */
export function Table({ caption, className, children, ...rest }: ComponentProps<'table'> & { caption?: ReactNode }) {
  const id = useId();
  return (
    <div
      role="region"
      aria-labelledby={caption ? `${id}-caption` : undefined}
      aria-label={caption ? undefined : 'Table'}
      tabIndex={0}
      className="relative max-w-full overflow-x-auto rounded-jar border border-brine-100 bg-white shadow-shelf"
    >
      <table className={cn('w-full border-collapse text-left text-sm', className)} {...rest}>
        {caption ? (
          <caption id={`${id}-caption`} className="px-4 pt-3 pb-1 text-left font-display text-base text-brine-900">
            {caption}
          </caption>
        ) : null}
        {children}
      </table>
    </div>
  );
}

export const THead = (props: ComponentProps<'thead'>) => <thead className="border-b border-brine-100 bg-brine-50 text-brine-900" {...props} />;
export const TBody = (props: ComponentProps<'tbody'>) => <tbody className="divide-y divide-brine-50" {...props} />;
export const TR = ({ className, ...rest }: ComponentProps<'tr'>) => <tr className={cn('hover:bg-paper', className)} {...rest} />;
export const TH = ({ className, scope = 'col', ...rest }: ComponentProps<'th'>) => (
  <th scope={scope} className={cn('px-4 py-2 font-semibold whitespace-nowrap', className)} {...rest} />
);
export const TD = ({ className, ...rest }: ComponentProps<'td'>) => <td className={cn('px-4 py-2 align-top', className)} {...rest} />;

/** The row shown when a table has nothing in it yet. */
export function EmptyRow({ colSpan, children }: { colSpan: number; children: ReactNode }) {
  return (
    <tr>
      <td colSpan={colSpan} className="px-4 py-8 text-center text-ink-soft">
        {children}
      </td>
    </tr>
  );
}
