import type { Metadata } from 'next';
import { LinkOutcome } from '@/components/account/link-outcome';
import { ResetPasswordForm } from '@/components/account/reset-password-form';
import { ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { resetLinkState } from '@/lib/account/reset';

export const metadata: Metadata = { title: 'Choose a new password' };
export const dynamic = 'force-dynamic';

const REFUSED = {
  used: {
    title: 'This link has already been used',
    body: 'Each link sets a password once, and a newer link replaces older ones. If you still need a new password, ask for a new link.',
  },
  expired: { title: 'This link has expired', body: 'Links to set a new password work for an hour. Ask for a new one; it arrives in a minute or two.' },
  invalid: { title: 'This link does not work', body: 'The link is incomplete. Copy the whole link from the e-mail, or ask for a new one.' },
};

export default async function ResetPasswordPage({ searchParams }: { searchParams: Promise<{ token?: string | string[] }> }) {
  const { token } = await searchParams;
  const state = typeof token === 'string' && token ? await resetLinkState(token) : 'invalid';
  if (state !== 'valid') {
    const copy = REFUSED[state];
    return (
      <LinkOutcome title={copy.title} body={copy.body}>
        <ButtonLink href="/forgot-password">Ask for a new link</ButtonLink>
      </LinkOutcome>
    );
  }
  return (
    <div className="mx-auto max-w-md space-y-4">
      <h1 className="text-3xl font-bold">Choose a new password</h1>
      <p className="text-ink-soft">Setting it signs your account out everywhere; then sign in with the new password.</p>
      <Card>
        <ResetPasswordForm token={token as string} />
      </Card>
    </div>
  );
}
