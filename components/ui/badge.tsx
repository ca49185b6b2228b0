import type { ReactNode } from 'react';
import { cn } from '@/lib/cn';

export type Tone = 'neutral' | 'brine' | 'copper' | 'honey' | 'beet';

const tones: Record<Tone, string> = {
  neutral: 'bg-paper-deep text-ink-soft ring-ink-faint/30',
  brine: 'bg-brine-50 text-brine-800 ring-brine-300',
  copper: 'bg-copper-50 text-copper-700 ring-copper-300',
  honey: 'bg-honey-50 text-honey-700 ring-honey-500/50',
  beet: 'bg-beet-50 text-beet-700 ring-beet-500/40',
};

export function Badge({ tone = 'neutral', children, className }: { tone?: Tone; children: ReactNode; className?: string }) {
  return (
    <span
      className={cn('inline-flex items-center rounded-full px-2.5 py-0.5 text-xs font-semibold whitespace-nowrap ring-1 ring-inset', tones[tone], className)}
    >
      {children}
    </span>
  );
}
