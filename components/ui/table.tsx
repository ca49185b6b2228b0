import type { ComponentProps, ReactNode } from 'react';
import { cn } from '@/lib/cn';

export function Table({ caption, className, children, ...rest }: ComponentProps<'table'> & { caption?: ReactNode }) {
  return (
    <div className="overflow-x-auto rounded-jar border border-brine-100 bg-white shadow-shelf">
      <table className={cn('w-full border-collapse text-left text-sm', className)} {...rest}>
        {caption ? <caption className="px-4 pt-3 pb-1 text-left font-display text-base text-brine-900">{caption}</caption> : null}
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
