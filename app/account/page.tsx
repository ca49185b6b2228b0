import type { Metadata } from 'next';
import Link from 'next/link';
import { EmailForm, NameForm, PasswordForm, ResendConfirmation, SignOutEverywhere } from '@/components/account/account-forms';
import { Card } from '@/components/ui/card';
import { readAccount } from '@/lib/account/profile';
import { requirePageRole } from '@/lib/auth/guard';

export const metadata: Metadata = { title: 'Your account' };

export default async function AccountPage() {
  const user = await requirePageRole('/account');
  const account = await readAccount(user.id);
  return (
    <div className="mx-auto max-w-2xl space-y-6">
      <h1 className="text-3xl font-bold">Your account</h1>
      <Card title="E-mail address">
        <p>
          <strong>{account.email}</strong> —{' '}
          {account.confirmed ? 'confirmed.' : 'not confirmed yet. Enrolling and receiving a certificate need a confirmed address.'}
        </p>
        {account.confirmed ? null : (
          <div className="mt-3">
            <ResendConfirmation />
          </div>
        )}
        {account.pendingEmail ? (
          <p className="mt-3 text-sm text-ink-soft">A change to {account.pendingEmail} waits for its confirmation link to be opened.</p>
        ) : null}
        <h3 className="mt-5 font-semibold">Change the address</h3>
        <p className="mb-3 text-sm text-ink-soft">We send a link to the new address; nothing changes until it is opened, and we tell the present address.</p>
        <EmailForm />
      </Card>
      <Card title="Name on certificates">
        {account.issuedCertificates ? (
          <p className="mb-3 text-sm text-ink-soft">
            Certificates already issued keep the name printed on them; the program coordinator can reissue one with a new name.
          </p>
        ) : null}
        <NameForm name={account.name} />
      </Card>
      <Card title="Password">
        <PasswordForm email={account.email} />
      </Card>
      <Card title="Sessions">
        <p className="mb-3">Signed in on a shared or lost device? End every session of your account, this one too.</p>
        <SignOutEverywhere />
      </Card>
      <Card title="Your data">
        <p>
          <a href="/api/account/export" download>
            Download everything we hold about you
          </a>{' '}
          (one ZIP file of JSON records and your practical photos).
        </p>
        <p className="mt-3">
          <Link href="/account/delete">Delete my account</Link> — see first what goes and what the program keeps. <Link href="/privacy">Privacy</Link>.
        </p>
      </Card>
    </div>
  );
}
