import type { Metadata } from 'next';
import Link from 'next/link';
import { ForgotPasswordForm } from '@/components/account/forgot-password-form';
import { Card } from '@/components/ui/card';

export const metadata: Metadata = { title: 'Forgot your password?' };

export default function ForgotPasswordPage() {
  return (
    <div className="mx-auto max-w-md space-y-4">
      <h1 className="text-3xl font-bold">Forgot your password?</h1>
      <p className="text-ink-soft">Type the e-mail address of your account. We send it a link to choose a new password; the link works once, for an hour.</p>
      <Card>
        <ForgotPasswordForm />
      </Card>
      <p className="text-sm text-ink-soft">
        Remembered it? <Link href="/signin">Sign in</Link>.
      </p>
    </div>
  );
}
