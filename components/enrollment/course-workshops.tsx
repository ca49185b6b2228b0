'use client';

import { useState } from 'react';
import useSWR from 'swr';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/text-field';
import { formatWorkshopDate, formatWorkshopTimes } from '@/lib/enrollment/format';
import type { PublicWorkshop } from '@/lib/enrollment/workshops';
import { ResendConfirmation } from '@/components/account/account-forms';
import { FetchError, fetchJson, postJson } from '@/lib/fetcher';

// The route answers the server's PublicWorkshop shape; the type import is erased from the client bundle.
export type WorkshopItem = PublicWorkshop;

const STATUS_LABEL: Record<string, string> = {
  awaiting_payment: 'Awaiting payment',
  active: 'You are enrolled',
  completed: 'Completed',
  withdrawn: 'Withdrawn',
};

/** Upcoming workshops of a course with seats left, and the enroll action (card payment or a fee waiver code). */
export function CourseWorkshops({ courseSlug }: { courseSlug: string }) {
  const { data, error, isLoading, mutate } = useSWR<{ workshops: WorkshopItem[] }, FetchError>(
    `/api/courses/${encodeURIComponent(courseSlug)}/workshops`,
    fetchJson,
  );

  return (
    <section aria-labelledby="workshops-heading" className="space-y-4">
      <h2 id="workshops-heading" className="font-display text-2xl font-bold text-brine-900">
        Upcoming workshops
      </h2>
      {isLoading ? (
        <ul aria-busy="true" aria-label="Loading workshops" className="space-y-3">
          {[0, 1].map((i) => (
            <li key={i} className="h-28 animate-pulse rounded-jar border border-brine-100 bg-paper-deep" />
          ))}
        </ul>
      ) : error ? (
        <div role="alert" className="rounded-jar border border-beet-500/40 bg-beet-50 p-4 text-beet-700">
          <p>{error instanceof Error ? error.message : 'The workshops could not be loaded.'}</p>
          <Button variant="secondary" size="sm" className="mt-2" onClick={() => mutate()}>
            Try again
          </Button>
        </div>
      ) : !data?.workshops.length ? (
        <p className="rounded-jar border border-brine-100 bg-white p-4 text-ink-soft">
          No workshops are scheduled for this course yet. The coordinator adds dates through the season; check back soon.
        </p>
      ) : (
        <ul className="space-y-3">
          {data.workshops.map((w) => (
            <WorkshopRow key={w.id} workshop={w} onEnrolled={() => mutate()} />
          ))}
        </ul>
      )}
    </section>
  );
}

function WorkshopRow({ workshop: w, onEnrolled }: { workshop: WorkshopItem; onEnrolled: () => void }) {
  const [pending, setPending] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const [unconfirmed, setUnconfirmed] = useState(false);
  const [showWaiver, setShowWaiver] = useState(false);
  const [waiverCode, setWaiverCode] = useState('');
  const headingId = `workshop-${w.id}`;
  const full = w.seatsLeft <= 0;
  const holding = w.myStatus === 'awaiting_payment' || w.myStatus === 'active' || w.myStatus === 'completed';

  async function enroll() {
    setPending(true);
    setMessage(null);
    try {
      const body = await postJson<{ url: string }>('/api/enrollments', { workshopId: w.id, ...(waiverCode.trim() ? { waiverCode: waiverCode.trim() } : {}) });
      // A checkout page to pay, or (with a waiver) straight to the confirmation.
      window.location.assign(body.url);
    } catch (e) {
      if (e instanceof FetchError && e.status === 401) {
        // A full load: the sign-in page then comes back to this course page with a fresh session.
        // eslint-disable-next-line @next/next/no-location-assign-relative-destination
        window.location.assign(`/signin?callbackUrl=${encodeURIComponent(window.location.pathname)}`);
        return;
      }
      setMessage(e instanceof FetchError ? (e.fields.waiverCode?.[0] ?? e.message) : 'The enrollment did not go through. Please try again.');
      setUnconfirmed(e instanceof FetchError && e.body.reason === 'email_unconfirmed');
      if (e instanceof FetchError && !e.unreachable) onEnrolled();
    } finally {
      setPending(false);
    }
  }

  return (
    <li aria-labelledby={headingId} className="rounded-jar border border-brine-100 bg-white p-4 shadow-shelf">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div className="space-y-1">
          <h3 id={headingId} className="text-lg font-bold text-brine-900">
            {formatWorkshopDate(w.startsAt, w.timeZone)}
          </h3>
          <p className="text-ink">{formatWorkshopTimes(w.startsAt, w.endsAt, w.timeZone)}</p>
          <p className="text-ink-soft">{w.place}</p>
          <p className="text-sm text-ink-soft">Instructor: {w.instructorName ?? 'to be announced'}</p>
          {w.attendanceRequired ? <p className="text-sm text-ink-soft">Attendance is required for the certificate.</p> : null}
        </div>
        <div className="flex flex-col items-end gap-2">
          <Badge tone={full ? 'beet' : w.seatsLeft <= 3 ? 'honey' : 'brine'}>{full ? 'Full' : `${w.seatsLeft} of ${w.seats} seats left`}</Badge>
          {w.myStatus ? <Badge tone="copper">{STATUS_LABEL[w.myStatus] ?? w.myStatus}</Badge> : null}
        </div>
      </div>
      {holding && w.myStatus !== 'awaiting_payment' ? null : (
        <div className="mt-3 space-y-2">
          {showWaiver ? (
            <TextField
              label="Fee waiver code"
              hint="From the program coordinator. Leave empty to pay by card."
              value={waiverCode}
              onChange={(e) => setWaiverCode(e.target.value)}
              autoComplete="off"
              className="max-w-xs"
            />
          ) : null}
          <div className="flex flex-wrap items-center gap-3">
            <Button onClick={enroll} pending={pending} disabled={full && !holding} aria-describedby={headingId}>
              {w.myStatus === 'awaiting_payment' ? 'Finish paying' : full ? 'Workshop full' : 'Enroll in this workshop'}
            </Button>
            {!showWaiver && !full ? (
              <Button variant="ghost" size="sm" onClick={() => setShowWaiver(true)}>
                I have a fee waiver code
              </Button>
            ) : null}
          </div>
          <p role="status" aria-live="polite" className="text-sm font-medium text-beet-600">
            {message}
          </p>
          {unconfirmed ? <ResendConfirmation /> : null}
        </div>
      )}
    </li>
  );
}
