import type { Check } from '@/lib/certificates/eligibility';

/** What an enrollment has done and what it still misses, as a list a screen reader can follow. */
export function Checklist({ checks, open = false }: { checks: Check[]; open?: boolean }) {
  const missing = checks.filter((c) => !c.met);
  return (
    <details open={open} className="text-sm">
      <summary className="cursor-pointer font-semibold text-brine-800">{missing.length === 0 ? 'All requirements met' : `${missing.length} missing`}</summary>
      <ul className="mt-2 space-y-1">
        {checks.map((c) => (
          <li key={c.key} className="flex gap-2">
            <span aria-hidden="true" className={c.met ? 'text-brine-700' : 'text-beet-600'}>
              {c.met ? '✓' : '✗'}
            </span>
            <span>
              <span className="sr-only">{c.met ? 'Done: ' : 'Missing: '}</span>
              <span className="font-medium">{c.label}</span> — {c.detail}
              {c.missing && c.missing.length > 0 ? <span className="block text-xs text-ink-soft">{c.missing.join(', ')}</span> : null}
            </span>
          </li>
        ))}
      </ul>
    </details>
  );
}
