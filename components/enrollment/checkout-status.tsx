'use client';

import { useRouter } from 'next/navigation';
import { useEffect } from 'react';
import useSWR from 'swr';
import { ButtonLink } from '@/components/ui/button';
import { formatMoney, formatWorkshopDate, formatWorkshopTimes } from '@/lib/enrollment/format';
import { fetchJson, type FetchError } from '@/lib/fetcher';

type Status = {
  id: number;
  status: 'awaiting_payment' | 'active' | 'completed' | 'withdrawn';
  courseSlug: string;
  courseTitle: string;
  feeCents: number;
  waived: boolean;
  workshop: { startsAt: string; endsAt: string; timeZone: string; place: string } | null;
  payment: { status: string; amountCents: number; currency: string } | null;
};

/** After checkout: polls the enrollment until the payment webhook has made it active, then opens the Pantry. */
export function CheckoutStatus({ enrollmentId }: { enrollmentId: number }) {
  const router = useRouter();
  const { data, error } = useSWR<{ enrollment: Status }, FetchError>(`/api/enrollments/${enrollmentId}`, fetchJson, {
    refreshInterval: (latest) => (latest?.enrollment.status === 'awaiting_payment' ? 1500 : 0),
  });
  const e = data?.enrollment;
  const done = e?.status === 'active' || e?.status === 'completed';

  useEffect(() => {
    if (!done) return;
    const t = setTimeout(() => router.push('/pantry'), 2500);
    return () => clearTimeout(t);
  }, [done, router]);

  if (error) {
    return (
      <p role="alert" className="text-beet-700">
        {error.message} Your payment is safe; reload this page in a moment.
      </p>
    );
  }
  if (!e) {
    return (
      <p role="status" aria-busy="true" className="text-ink-soft">
        Checking your enrollment…
      </p>
    );
  }
  return (
    <div className="space-y-4">
      <div role="status" aria-live="polite">
        {done ? (
          <>
            <h1 className="font-display text-2xl font-bold text-brine-900">You are enrolled</h1>
            <p className="mt-2 text-ink">
              {e.courseTitle} is now in your Pantry. {e.waived ? 'Your fee waiver was applied.' : 'A receipt is on its way by e-mail.'} Taking you to your
              Pantry…
            </p>
          </>
        ) : e.status === 'awaiting_payment' ? (
          <>
            <h1 className="font-display text-2xl font-bold text-brine-900">Confirming your payment…</h1>
            <p className="mt-2 text-ink">
              The payment service is telling Brinewright about your payment. This usually takes a few seconds; keep this page open.
            </p>
          </>
        ) : (
          <>
            <h1 className="font-display text-2xl font-bold text-brine-900">This enrollment is no longer open</h1>
            <p className="mt-2 text-ink">The checkout expired or the place was given up. You can choose a workshop again from the course page.</p>
          </>
        )}
      </div>
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
        <dt className="font-semibold">Course</dt>
        <dd>{e.courseTitle}</dd>
        {e.workshop ? (
          <>
            <dt className="font-semibold">Workshop</dt>
            <dd>
              {formatWorkshopDate(e.workshop.startsAt, e.workshop.timeZone)}, {formatWorkshopTimes(e.workshop.startsAt, e.workshop.endsAt, e.workshop.timeZone)}
            </dd>
            <dt className="font-semibold">Place</dt>
            <dd>{e.workshop.place}</dd>
          </>
        ) : null}
        <dt className="font-semibold">Fee</dt>
        <dd>{e.waived ? 'Waived' : formatMoney(e.payment?.amountCents ?? e.feeCents, e.payment?.currency ?? 'usd')}</dd>
      </dl>
      <div className="flex flex-wrap gap-3">
        {done ? <ButtonLink href="/pantry">Open my Pantry</ButtonLink> : null}
        {e.status === 'withdrawn' ? <ButtonLink href={`/courses/${e.courseSlug}`}>Choose a workshop</ButtonLink> : null}
      </div>
    </div>
  );
}
