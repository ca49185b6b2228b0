import { Badge } from '@/components/ui/badge';
import { formatDateTime } from '@/lib/local-time';
import type { RoundView } from '@/lib/practicals/data';
import { RUBRIC_CRITERIA } from '@/lib/validations/practical';
import { STATE_NAME, batchName, batchTitle } from '@/lib/practicals/words';
import { FlagList } from './flag-list';
import { PRACTICAL_STATUS_LABEL, PRACTICAL_STATUS_TONE } from './practical-status';

/** One review: the decision, the rubric criterion by criterion, and the comment. */
export function ReviewSummary({ review, timeZone }: { review: RoundView['reviews'][number]; timeZone: string }) {
  return (
    <div className="space-y-2 rounded-lg border border-brine-100 bg-white p-3" data-testid="review-summary">
      <p className="text-sm">
        <Badge tone={PRACTICAL_STATUS_TONE[review.decision]}>{STATE_NAME[review.decision]}</Badge> by {review.reviewerName},{' '}
        {formatDateTime(review.createdAt, timeZone)}
      </p>
      {review.comment ? (
        <p className="text-sm">
          <span className="font-semibold">{review.decision === 'approved' ? 'Comment' : 'For the next batch'}:</span> {review.comment}
        </p>
      ) : null}
      <ul className="grid gap-1 text-sm sm:grid-cols-2">
        {RUBRIC_CRITERIA.map((c) => {
          const entry = review.rubric[c.id];
          if (!entry) return null;
          return (
            <li key={c.id}>
              <span aria-hidden="true">{entry.verdict === 'met' ? '✓ ' : '✗ '}</span>
              {c.label}: <strong>{entry.verdict === 'met' ? 'met' : 'not met'}</strong>
              {entry.comment ? <span className="text-ink-soft"> — {entry.comment}</span> : null}
            </li>
          );
        })}
      </ul>
    </div>
  );
}

/** Every batch of a practical, newest first, with its flags, photos and reviews. */
export function PracticalHistory({ rounds, timeZone }: { rounds: RoundView[]; timeZone: string }) {
  if (!rounds.length) return null;
  return (
    <section aria-labelledby="practical-history" className="space-y-4">
      <h2 id="practical-history" className="text-xl font-bold">
        Your batches
      </h2>
      <ol className="space-y-4">
        {rounds.map((r) => (
          <li key={r.id} className="space-y-3 rounded-jar border border-brine-100 bg-white p-4 shadow-shelf" data-testid={`round-${r.round}`}>
            <div className="flex flex-wrap items-center gap-2">
              <h3 className="font-display text-lg font-bold">{batchTitle(r.round)}</h3>
              <Badge tone={PRACTICAL_STATUS_TONE[r.status]}>{PRACTICAL_STATUS_LABEL[r.status]}</Badge>
              <span className="text-sm text-ink-soft">sent {formatDateTime(r.submittedAt, timeZone)}</span>
            </div>
            <p className="text-sm text-ink-soft">
              {[
                r.details.recipeTitle,
                r.details.jars && r.details.jar ? `${r.details.jars} × ${r.details.jar}` : null,
                typeof r.details.minutes === 'number' && typeof r.details.altitudeFt === 'number'
                  ? `${r.details.minutes} min at ${r.details.altitudeFt.toLocaleString('en-US')} ft`
                  : null,
              ]
                .filter(Boolean)
                .join(' · ')}
            </p>
            {r.photos.length ? (
              <ul className="flex flex-wrap gap-2" aria-label={`Photos of the ${batchName(r.round)}`}>
                {r.photos.map((p, i) => (
                  <li key={p.id}>
                    <a href={p.url} target="_blank" rel="noreferrer">
                      <img src={p.thumbnailUrl} alt={`${batchTitle(r.round)}, photo ${i + 1}`} className="h-16 w-16 rounded object-cover" />
                    </a>
                  </li>
                ))}
              </ul>
            ) : null}
            <FlagList flags={r.flags} title={`To double-check on the ${batchName(r.round)}`} level="h4" />
            {r.reviews.map((review) => (
              <ReviewSummary key={review.id} review={review} timeZone={timeZone} />
            ))}
          </li>
        ))}
      </ol>
    </section>
  );
}
