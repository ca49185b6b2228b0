import Link from 'next/link';
import { Badge } from '@/components/ui/badge';
import { formatDate as formatLocalDate } from '@/lib/local-time';
import type { Verification } from '@/lib/certificates/lookup';

const STATE = {
  valid: { label: 'Valid', tone: 'brine', sentence: 'This certificate is valid.' },
  expired: { label: 'Expired', tone: 'honey', sentence: 'This certificate was genuine but has expired.' },
  revoked: { label: 'Revoked', tone: 'beet', sentence: 'This certificate was revoked by the program and is no longer valid.' },
} as const;
const REPLACED = { label: 'Replaced', tone: 'honey', sentence: 'This certificate was replaced by a corrected one.' } as const;

/** The public answer: the state, the name, the course and the dates, and nothing more. */
/** `timeZone`: the program's, in which the certificate's dates are shown. */
export function VerificationResult({ result, timeZone }: { result: Verification; timeZone: string }) {
  const formatDate = (iso: string) => formatLocalDate(iso, timeZone);
  if (!result.found) {
    return (
      <div role="status" className="rounded-jar border-l-4 border-beet-500 bg-beet-50 p-4">
        <p className="font-semibold text-beet-700">{result.reason === 'malformed' ? 'That is not a valid serial.' : 'No certificate has this serial.'}</p>
        <p className="mt-1 text-sm">
          {result.reason === 'malformed'
            ? 'Check the 16 characters again: the last one is a check character, so a single typo is caught here.'
            : 'The serial is well formed but no certificate was issued with it. Check it against the certificate.'}{' '}
          <span className="font-mono">{result.serial}</span>
        </p>
      </div>
    );
  }
  const state = result.replaced ? REPLACED : STATE[result.state];
  return (
    <section aria-labelledby="result-heading" className="rounded-jar border border-brine-100 bg-white p-5 shadow-shelf">
      <div className="mb-3 flex items-center gap-3">
        <h2 id="result-heading" className="text-xl font-bold">
          {state.sentence}
        </h2>
        <Badge tone={state.tone}>{state.label}</Badge>
      </div>
      {result.replaced ? (
        <p className="mb-3">
          On {formatDate(result.replaced.at)} the program corrected this certificate and issued it again as{' '}
          <Link className="font-mono" href={`/verify/${result.replaced.bySerial}`}>
            {result.replaced.bySerial}
          </Link>
          . Check that serial for the certificate in force; below is what this one said.
        </p>
      ) : null}
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2">
        <dt className="font-semibold">Serial</dt>
        <dd className="font-mono">{result.serial}</dd>
        <dt className="font-semibold">Name</dt>
        <dd>{result.learnerName}</dd>
        <dt className="font-semibold">Course</dt>
        <dd>{result.courseTitle}</dd>
        <dt className="font-semibold">Program</dt>
        <dd>{result.programName}</dd>
        <dt className="font-semibold">Issued</dt>
        <dd>{formatDate(result.issuedAt)}</dd>
        <dt className="font-semibold">Valid until</dt>
        <dd>{formatDate(result.validUntil)}</dd>
        {result.revokedAt ? (
          <>
            <dt className="font-semibold">Revoked</dt>
            <dd>{formatDate(result.revokedAt)}</dd>
          </>
        ) : null}
      </dl>
    </section>
  );
}
