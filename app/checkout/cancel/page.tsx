import type { Metadata } from 'next';
import { ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/guard';
import { fetchEnrollmentStatus } from '@/lib/enrollment/queries';

export const metadata: Metadata = { title: 'Payment not finished' };
export const dynamic = 'force-dynamic';

export default async function CheckoutCancelPage({ searchParams }: { searchParams: Promise<{ enrollment?: string | string[] }> }) {
  const { enrollment } = await searchParams;
  const user = await requirePageRole(`/checkout/cancel?enrollment=${encodeURIComponent(String(enrollment ?? ''))}`, 'learner');
  const status = typeof enrollment === 'string' && /^\d+$/.test(enrollment) ? await fetchEnrollmentStatus({ id: Number(enrollment) }) : null;
  const mine = status && status.userId === user.id ? status : null;
  return (
    <div className="mx-auto max-w-xl py-10">
      <Card>
        <h1 className="font-display text-2xl font-bold text-brine-900">Payment not finished</h1>
        <p className="mt-2 text-ink">
          Nothing was charged.{' '}
          {mine?.status === 'awaiting_payment'
            ? 'Your seat is held for a short while; choose “Finish paying” on the course page to complete it. If you do not, the seat goes back to the workshop when the checkout expires.'
            : 'You can choose a workshop again from the course page.'}
        </p>
        <div className="mt-4 flex flex-wrap gap-3">
          <ButtonLink href={mine ? `/courses/${mine.courseSlug}` : '/'}>Back to the course</ButtonLink>
          <ButtonLink href="/pantry" variant="secondary">
            My Pantry
          </ButtonLink>
        </div>
      </Card>
    </div>
  );
}
