import type { Metadata } from 'next';
import { ButtonLink } from '@/components/ui/button';
import { LinkOutcome } from '@/components/account/link-outcome';
import { confirmEmailChange, type EmailChangeOutcome } from '@/lib/account/profile';

export const metadata: Metadata = { title: 'Confirm your new e-mail address' };
export const dynamic = 'force-dynamic';

const COPY: Record<EmailChangeOutcome, { title: string; body: string; href: string; action: string }> = {
  changed: {
    title: 'Your e-mail address is changed',
    body: 'From now on we write to this address. Every session of your account was signed out: sign in with the new address.',
    href: '/signin',
    action: 'Sign in',
  },
  used: {
    title: 'This link has already been used',
    body: 'The change it asked for was made, or a newer link replaced it.',
    href: '/account',
    action: 'Open my account',
  },
  expired: {
    title: 'This link has expired',
    body: 'Links to change an address work for a day. Ask again from your account page.',
    href: '/account',
    action: 'Open my account',
  },
  invalid: {
    title: 'This link does not work',
    body: 'The link is incomplete. Copy the whole link from the e-mail.',
    href: '/account',
    action: 'Open my account',
  },
  taken: {
    title: 'That address is taken',
    body: 'Another account started using this address after you asked. Your account keeps its present address.',
    href: '/account',
    action: 'Open my account',
  },
};

export default async function ConfirmEmailChangePage({ searchParams }: { searchParams: Promise<{ token?: string | string[] }> }) {
  const { token } = await searchParams;
  const outcome = typeof token === 'string' && token ? await confirmEmailChange(token) : 'invalid';
  const copy = COPY[outcome];
  return (
    <LinkOutcome title={copy.title} body={copy.body}>
      <ButtonLink href={copy.href}>{copy.action}</ButtonLink>
    </LinkOutcome>
  );
}
