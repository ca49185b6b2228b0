import Link from 'next/link';
import { Badge, type Tone } from '@/components/ui/badge';
import { cn } from '@/lib/cn';
import { formatShortDate } from '@/lib/local-time';
import { STATE_NAME, batchTitle, type PracticalState } from '@/lib/practicals/words';

export type PracticalStatusValue = PracticalState;

export type PracticalStatusProps = {
  courseSlug: string;
  /** The newest batch, or null when nothing has been submitted yet. */
  latest: {
    round: number;
    status: PracticalStatusValue;
    submittedAt: string;
    flagCount: number;
    review?: { decision: 'approved' | 'changes_requested'; comment: string | null; reviewerName: string; createdAt: string } | null;
  } | null;
  /** The zone the dates are shown in: the learner's workshop's, or the program's. */
  timeZone: string;
  className?: string;
};

export const PRACTICAL_STATUS_LABEL: Record<PracticalStatusValue, string> = STATE_NAME;
// Honey while it waits, copper when the learner has another batch to make, brine once it passed.
export const PRACTICAL_STATUS_TONE: Record<PracticalStatusValue, Tone> = { submitted: 'honey', changes_requested: 'copper', approved: 'brine' };

/** A small panel with where a learner's practical stands: for the Pantry and the practical page. */
export function PracticalStatus({ courseSlug, latest, timeZone, className }: PracticalStatusProps) {
  const day = (iso: string) => formatShortDate(iso, timeZone);
  const href = `/learn/${courseSlug}/practical`;
  return (
    <div className={cn('space-y-2 rounded-lg border border-brine-100 bg-paper p-3 text-sm', className)} data-testid="practical-status">
      <div className="flex flex-wrap items-center gap-2">
        <span className="font-semibold">Practical batch</span>
        {latest ? <Badge tone={PRACTICAL_STATUS_TONE[latest.status]}>{PRACTICAL_STATUS_LABEL[latest.status]}</Badge> : <Badge>Not submitted</Badge>}
      </div>
      {latest ? (
        <p className="text-ink-soft">
          {batchTitle(latest.round)}, sent {day(latest.submittedAt)}
          {latest.flagCount ? ` with ${latest.flagCount} thing${latest.flagCount === 1 ? '' : 's'} to double-check` : ''}.
          {latest.review ? ` Reviewed by ${latest.review.reviewerName} on ${day(latest.review.createdAt)}.` : ''}
        </p>
      ) : (
        <p className="text-ink-soft">Put up a batch from a tested recipe at home, then submit its details and 2 to 6 photos.</p>
      )}
      {latest?.review?.decision === 'changes_requested' && latest.review.comment ? (
        <p>
          <span className="font-semibold">For the next batch:</span> {latest.review.comment}
        </p>
      ) : null}
      <Link href={href} className="font-semibold">
        {!latest ? 'Submit your practical' : latest.status === 'changes_requested' ? 'See the notes and send another batch' : 'See your practical'}
      </Link>
    </div>
  );
}
