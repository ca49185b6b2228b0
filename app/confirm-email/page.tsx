import type { Metadata } from 'next';
import { ResendConfirmation } from '@/components/account/account-forms';
import { ButtonLink } from '@/components/ui/button';
import { LinkOutcome } from '@/components/account/link-outcome';
import { confirmEmailAddress, type ConfirmOutcome } from '@/lib/email/confirm';

export const metadata: Metadata = { title: 'Confirm your e-mail address' };
export const dynamic = 'force-dynamic';

const COPY: Record<ConfirmOutcome, { title: string; body: string }> = {
  confirmed: {
    title: 'Your e-mail address is confirmed',
    body: 'Thank you. Receipts, workshop reminders and your certificate will reach you at this address.',
  },
  already: { title: 'Already confirmed', body: 'This address was confirmed before; there is nothing more to do.' },
  expired: { title: 'This link has expired', body: 'Confirmation links work for seven days. Send yourself a new one (you may be asked to sign in first).' },
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
    <LinkOutcome title={copy.title} body={copy.body}>
      {outcome === 'expired' ? <ResendConfirmation /> : null}
      <ButtonLink href="/pantry">Go to my Pantry</ButtonLink>
    </LinkOutcome>
  );
}
