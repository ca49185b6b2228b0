import type { Metadata } from 'next';
import { CheckoutStatus } from '@/components/enrollment/checkout-status';
import { ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/guard';
import { fetchEnrollmentIdForSession, fetchEnrollmentStatus } from '@/lib/enrollment/queries';

export const metadata: Metadata = { title: 'Your enrollment' };
export const dynamic = 'force-dynamic';

type Search = { session_id?: string | string[]; enrollment?: string | string[] };

export default async function CheckoutSuccessPage({ searchParams }: { searchParams: Promise<Search> }) {
  const search = await searchParams;
  const sessionId = typeof search.session_id === 'string' ? search.session_id : null;
  const query = sessionId ? `session_id=${encodeURIComponent(sessionId)}` : `enrollment=${encodeURIComponent(String(search.enrollment ?? ''))}`;
  const user = await requirePageRole(`/checkout/success?${query}`, 'learner');
  let enrollmentId: number | null = null;
  if (sessionId) enrollmentId = await fetchEnrollmentIdForSession({ sessionId, userId: user.id });
  else if (typeof search.enrollment === 'string' && /^\d+$/.test(search.enrollment)) {
    const status = await fetchEnrollmentStatus({ id: Number(search.enrollment) });
    enrollmentId = status && status.userId === user.id ? status.id : null;
  }
  return (
    <div className="mx-auto max-w-xl py-10">
      <Card>
        {enrollmentId ? (
          <CheckoutStatus enrollmentId={enrollmentId} />
        ) : (
          <>
            <h1 className="font-display text-2xl font-bold text-brine-900">We could not find that checkout</h1>
            <p className="mt-2 text-ink">If you paid, your enrollment appears in your Pantry within a minute.</p>
            <div className="mt-4">
              <ButtonLink href="/pantry">Go to my Pantry</ButtonLink>
            </div>
          </>
        )}
      </Card>
    </div>
  );
}
