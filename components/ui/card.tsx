import type { ComponentProps, ReactNode } from 'react';
import { cn } from '@/lib/cn';

export function Card({ title, actions, className, children, ...rest }: Omit<ComponentProps<'section'>, 'title'> & { title?: ReactNode; actions?: ReactNode }) {
  return (
    <section className={cn('rounded-jar border border-brine-100 bg-white p-5 shadow-shelf', className)} {...rest}>
      {title || actions ? (
        <div className="mb-3 flex items-start justify-between gap-3">
          {title ? <h2 className="text-lg font-bold">{title}</h2> : <span />}
          {actions}
        </div>
      ) : null}
      {children}
    </section>
  );
}
