import type { ReactNode } from 'react';
import { Card } from '@/components/ui/card';

/** The page an e-mailed link opens: what happened, and where to go next. */
export function LinkOutcome({ title, body, children }: { title: string; body: string; children: ReactNode }) {
  return (
    <div className="mx-auto max-w-xl py-10">
      <Card>
        <h1 className="font-display text-2xl font-bold text-brine-900">{title}</h1>
        <p className="mt-3 text-ink">{body}</p>
        <div className="mt-5 space-y-4">{children}</div>
      </Card>
    </div>
  );
}
