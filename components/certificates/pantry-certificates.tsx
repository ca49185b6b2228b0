import Link from 'next/link';
import { Badge } from '@/components/ui/badge';
import { ButtonLink, buttonClasses } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { claimableRefreshers } from '@/lib/certificates/issue';
import { fetchLearnerCertificates, type LearnerCertificate } from '@/lib/certificates/lookup';
import { formatDate as formatLocalDate } from '@/lib/local-time';
import { getProgramIdentity } from '@/lib/program/settings';
import { ClaimRefresher } from './claim-refresher';
import { REFRESHER_COURSE_SLUG, refresherDue } from '@/lib/certificates/validity';

const TONE = { valid: 'brine', expired: 'honey', revoked: 'beet' } as const;
const LABEL = { valid: 'Valid', expired: 'Expired', revoked: 'Revoked' } as const;

/** The learner's certificates in the Pantry: download, expiry, and the refresher when it is due. */
export async function PantryCertificates({ userId, now = new Date() }: { userId: number; now?: Date }) {
  const [certificates, claimable, program] = await Promise.all([fetchLearnerCertificates({ userId, now }), claimableRefreshers(userId), getProgramIdentity()]);
  if (certificates.length === 0 && claimable.length === 0) return null;
  // A newer certificate in the same line (the refresher) supersedes the offer on an older one.
  const latestValidUntil = Math.max(...certificates.filter((c) => !c.revokedAt).map((c) => c.validUntil.getTime()), 0);
  const offer = certificates.some((c) => refresherDue(c, now) && c.validUntil.getTime() === latestValidUntil);
  return (
    <section aria-labelledby="pantry-certificates" className="space-y-3">
      <h2 id="pantry-certificates" className="text-2xl font-bold">
        Your certificates
      </h2>
      {claimable.map((id) => (
        <ClaimRefresher key={id} enrollmentId={id} />
      ))}
      {offer && claimable.length === 0 ? <RefresherOffer expired={latestValidUntil < now.getTime()} /> : null}
      <ul className="grid gap-4 md:grid-cols-2">
        {certificates.map((c) => (
          <li key={c.id}>
            <CertificateCard certificate={c} now={now} timeZone={program.timeZone} />
          </li>
        ))}
      </ul>
    </section>
  );
}

function CertificateCard({ certificate: c, now, timeZone }: { certificate: LearnerCertificate; now: Date; timeZone: string }) {
  const formatDate = (d: Date) => formatLocalDate(d, timeZone);
  const daysLeft = Math.ceil((c.validUntil.getTime() - now.getTime()) / 86_400_000);
  return (
    <Card title={c.courseTitle} actions={<Badge tone={TONE[c.state]}>{LABEL[c.state]}</Badge>}>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
        <dt className="font-semibold">Serial</dt>
        <dd className="font-mono">{c.serial}</dd>
        <dt className="font-semibold">Issued</dt>
        <dd>{formatDate(c.issuedAt)}</dd>
        <dt className="font-semibold">{c.state === 'expired' ? 'Expired' : 'Valid until'}</dt>
        <dd>
          {formatDate(c.validUntil)}
          {c.state === 'valid' && daysLeft <= 90 ? <span className="ml-1 text-honey-700">(in {daysLeft} days)</span> : null}
        </dd>
      </dl>
      <div className="mt-4 flex flex-wrap gap-2">
        {c.state !== 'revoked' ? (
          <a className={buttonClasses('primary', 'sm')} href={`/api/certificates/${c.serial}/pdf`} download>
            Download PDF<span className="sr-only"> of {c.courseTitle}</span>
          </a>
        ) : (
          <p className="text-sm text-beet-700">This certificate was revoked. Contact the program coordinator with questions.</p>
        )}
        <Link className={buttonClasses('secondary', 'sm')} href={`/verify/${c.serial}`}>
          Verification page<span className="sr-only"> of {c.serial}</span>
        </Link>
      </div>
    </Card>
  );
}

function RefresherOffer({ expired }: { expired: boolean }) {
  return (
    <div className="rounded-jar border-l-4 border-copper-500 bg-copper-50 p-4">
      <p className="font-semibold">{expired ? 'Your certificate has expired.' : 'Your certificate expires soon.'}</p>
      <p className="mt-1 text-sm">
        The volunteer refresher reviews acidity, processing time and altitude. Completing it issues a new certificate whose validity runs on from the end of
        your current one{expired ? ', or from the day it is issued if your certificate lapsed more than a year ago' : ''}.
      </p>
      <ButtonLink className="mt-3" size="sm" href={`/courses/${REFRESHER_COURSE_SLUG}`}>
        See the refresher course
      </ButtonLink>
    </div>
  );
}
