import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { FlagList } from '@/components/practicals/flag-list';
import { ReviewSummary } from '@/components/practicals/practical-history';
import { PRACTICAL_STATUS_LABEL, PRACTICAL_STATUS_TONE } from '@/components/practicals/practical-status';
import { BackToTable } from '@/components/tasting-table/back-to-table';
import { BatchDetails } from '@/components/tasting-table/batch-details';
import { PhotoViewer } from '@/components/tasting-table/photo-viewer';
import { DecisionPanel } from '@/components/tasting-table/decision-panel';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/guard';
import { computeExpectations } from '@/lib/practicals/checks';
import { fetchSubmission } from '@/lib/practicals/data';
import { decisionRightFor } from '@/lib/practicals/service';
import { formatDateTime, formatShortDate } from '@/lib/local-time';
import { getProgramIdentity } from '@/lib/program/settings';
import { batchName, batchTitle } from '@/lib/practicals/words';

export const metadata: Metadata = { title: 'Practical batch at the Tasting table' };

export default async function SubmissionPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await requirePageRole(`/tasting-table/submissions/${id}`, 'instructor');
  if (!/^\d{1,10}$/.test(id)) notFound();
  const [submission, right, program] = await Promise.all([fetchSubmission({ id: Number(id) }), decisionRightFor(viewer, Number(id)), getProgramIdentity()]);
  if (!submission || !right) notFound();
  const { round, earlierRounds, learner, course, workshop } = submission;
  // Times in the learner's workshop's zone, or the program's for a learner without a workshop.
  const timeZone = workshop?.timeZone ?? program.timeZone;
  const when = (iso: string) => formatDateTime(iso, timeZone);
  const expected = computeExpectations(round.details);

  return (
    <div className="space-y-6">
      <p className="text-sm">
        <BackToTable />
      </p>
      <header className="space-y-1">
        <h1 className="text-3xl font-bold">
          {learner.name}, {batchName(round.round)}
        </h1>
        <p className="flex flex-wrap items-center gap-2 text-ink-soft">
          <Badge tone={PRACTICAL_STATUS_TONE[round.status]}>{PRACTICAL_STATUS_LABEL[round.status]}</Badge>
          <span>
            {course.title} · sent {when(round.submittedAt)}
            {workshop ? ` · workshop ${formatShortDate(workshop.startsAt, workshop.timeZone)}, ${workshop.place.split(',')[0]}` : ' · self-paced'}
          </span>
        </p>
      </header>

      <div className="grid gap-6 lg:grid-cols-2">
        <div className="space-y-4">
          <PhotoViewer photos={round.photos} label={`Photos of the ${batchName(round.round)}`} />
          <FlagList flags={round.flags} title="Numbers to double-check" />
        </div>
        <BatchDetails details={round.details} expected={expected} />
      </div>

      {round.reviews.length ? (
        <Card title="Review">
          {round.reviews.map((r) => (
            <ReviewSummary key={r.id} review={r} timeZone={timeZone} />
          ))}
        </Card>
      ) : null}
      {round.status === 'submitted' ? (
        <Card title="Rubric and decision">
          <DecisionPanel practicalId={round.id} round={round.round} right={right} claim={submission.claim} viewer={viewer} />
        </Card>
      ) : null}

      {earlierRounds.length ? (
        <section aria-labelledby="earlier-batches" className="space-y-3">
          <h2 id="earlier-batches" className="text-xl font-bold">
            Earlier batches
          </h2>
          {earlierRounds.map((r) => (
            <Card key={r.id} title={`${batchTitle(r.round)}: ${PRACTICAL_STATUS_LABEL[r.status]}`}>
              <div className="space-y-3">
                <p className="text-sm text-ink-soft">
                  Sent {when(r.submittedAt)}. <Link href={`/tasting-table/submissions/${r.id}`}>Open the {batchName(r.round)}</Link>
                </p>
                <FlagList flags={r.flags} title={`To double-check on the ${batchName(r.round)}`} level="h3" />
                {r.reviews.map((review) => (
                  <ReviewSummary key={review.id} review={review} timeZone={timeZone} />
                ))}
              </div>
            </Card>
          ))}
        </section>
      ) : null}
    </div>
  );
}
