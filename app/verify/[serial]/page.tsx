import type { Metadata } from 'next';
import { headers } from 'next/headers';
import Link from 'next/link';
import { SerialForm } from '@/components/certificates/serial-form';
import { VerificationResult } from '@/components/certificates/verification-result';
import { clientAddress } from '@/lib/auth/options';
import { verifyForAddress, type Verification } from '@/lib/certificates/lookup';
import { AppError, decodeParam } from '@/lib/errors';
import { getProgramIdentity } from '@/lib/program/settings';

export const metadata: Metadata = { title: 'Certificate check', robots: { index: false } };
export const dynamic = 'force-dynamic';

export default async function VerifySerialPage({ params }: { params: Promise<{ serial: string }> }) {
  const raw = decodeParam((await params).serial).slice(0, 40);
  const program = await getProgramIdentity();
  let result: Verification | null = null;
  let throttled = false;
  try {
    result = await verifyForAddress(raw, clientAddress(await headers()));
  } catch (error) {
    if (error instanceof AppError && error.type === 'rate_limit') throttled = true;
    else throw error;
  }
  return (
    <div className="mx-auto max-w-xl space-y-6">
      <h1 className="text-3xl font-bold">Certificate check</h1>
      {throttled ? (
        <div role="alert" className="rounded-jar border-l-4 border-honey-500 bg-honey-50 p-4">
          Too many certificate checks came from your address in the last few minutes. Please wait a little and try again.
        </div>
      ) : (
        <VerificationResult result={result!} timeZone={program.timeZone} />
      )}
      <section aria-labelledby="check-another" className="space-y-3">
        <h2 id="check-another" className="text-lg font-bold">
          Check another serial
        </h2>
        <SerialForm />
      </section>
      {program.contactEmail || program.contactPhone ? (
        <p data-testid="program-contact">
          Questions about a certificate: {program.name}
          {program.contactEmail ? (
            <>
              , <a href={`mailto:${program.contactEmail}`}>{program.contactEmail}</a>
            </>
          ) : null}
          {program.contactPhone ? <>, {program.contactPhone}</> : null}.
        </p>
      ) : null}
      <p className="text-sm text-ink-soft">
        A certificate records that its holder completed the program&apos;s training. It does not certify any recipe or product as safe.{' '}
        <Link href="/courses">About the courses</Link>
      </p>
    </div>
  );
}
