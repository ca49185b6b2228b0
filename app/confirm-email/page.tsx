import type { Metadata } from 'next';
import { ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { confirmEmailAddress, type ConfirmOutcome } from '@/lib/email/confirm';

export const metadata: Metadata = { title: 'Confirm your e-mail address' };
export const dynamic = 'force-dynamic';

const COPY: Record<ConfirmOutcome, { title: string; body: string }> = {
  confirmed: {
    title: 'Your e-mail address is confirmed',
    body: 'Thank you. Receipts, workshop reminders and your certificate will reach you at this address.',
  },
  already: { title: 'Already confirmed', body: 'This address was confirmed before; there is nothing more to do.' },
  expired: { title: 'This link has expired', body: 'Confirmation links work for seven days. Sign in and ask the program coordinator for a new one.' },
  invalid: {
    title: 'This link does not work',
    body: 'The link is incomplete or was made for another address. Copy the whole link from the e-mail and try again.',
  },
};

export default async function ConfirmEmailPage({ searchParams }: { searchParams: Promise<{ token?: string | string[] }> }) {
  const { token } = await searchParams;
  const outcome = typeof token === 'string' && token ? await confirmEmailAddress(token) : 'invalid';
  const copy = COPY[outcome];
  return (
    <div className="mx-auto max-w-xl py-10">
      <Card>
        <h1 className="font-display text-2xl font-bold text-brine-900">{copy.title}</h1>
        <p className="mt-3 text-ink">{copy.body}</p>
        <div className="mt-5">
          <ButtonLink href="/pantry">Go to my Pantry</ButtonLink>
        </div>
      </Card>
    </div>
  );
}
