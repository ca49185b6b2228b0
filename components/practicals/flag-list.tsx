import type { Flag } from '@/lib/practicals/checks';
import { cn } from '@/lib/cn';

const CHECK_LABEL: Record<Flag['check'], string> = {
  'processing-time': 'Processing time',
  'processing-method': 'Processing method',
  'sterilized-jars': 'Sterilised jars',
  pack: 'Pack',
  headspace: 'Headspace',
  'vinegar-acidity': 'Vinegar acidity',
  dilution: 'Brine dilution',
  'brine-strength': 'Brine salt by weight',
  seals: 'Seals',
};

/** The automatic checks that failed, each with its reason; empty shows a quiet all-clear line. */
export function FlagList({
  flags,
  title = 'Numbers to double-check',
  live = false,
  level = 'h2',
  notChecked = [],
  className,
}: {
  flags: Flag[];
  title?: string;
  live?: boolean;
  /** Labels of the fields the checks need that are still empty (the form as it is being filled in). */
  notChecked?: readonly string[];
  level?: 'h2' | 'h3' | 'h4';
  className?: string;
}) {
  const Heading = level;
  return (
    <section
      aria-label={title}
      className={cn('rounded-jar border p-4', flags.length ? 'border-honey-500/60 bg-honey-50' : 'border-brine-100 bg-brine-50', className)}
    >
      <Heading className="text-base font-bold">{title}</Heading>
      <div aria-live={live ? 'polite' : undefined}>
        {flags.length === 0 && notChecked.length > 0 ? (
          <p className="mt-1 text-sm text-ink-soft">Nothing to double-check so far.</p>
        ) : flags.length === 0 ? (
          <p className="mt-1 text-sm text-ink-soft">
            Nothing to double-check: the numbers entered match the published tables Brinewright checks. That does not make a batch safe; follow the tested
            recipe.
          </p>
        ) : (
          <ul className="mt-2 space-y-2" data-testid="flags">
            {flags.map((flag, i) => (
              <li key={`${flag.check}-${i}`} className="text-sm">
                <span className="font-semibold text-honey-700">
                  <span aria-hidden="true">⚑ </span>
                  {CHECK_LABEL[flag.check] ?? flag.check}:
                </span>{' '}
                {flag.message}
                {flag.source ? <span className="block text-xs text-ink-soft">Source: {flag.source}</span> : null}
              </li>
            ))}
          </ul>
        )}
        {notChecked.length > 0 ? (
          <p className="mt-2 text-sm text-ink-soft" data-testid="not-checked">
            Not checked yet, until you enter them: {notChecked.join(', ')}.
          </p>
        ) : null}
      </div>
    </section>
  );
}
