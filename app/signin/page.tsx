import type { Metadata } from 'next';
import Link from 'next/link';
import { SignInForm } from '@/components/auth/sign-in-form';
import { Card } from '@/components/ui/card';

export const metadata: Metadata = { title: 'Sign in' };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string; error?: string }> }) {
  const { callbackUrl, error } = await searchParams;
  return (
    <div className="mx-auto max-w-md space-y-4">
      <h1 className="text-3xl font-bold">Sign in</h1>
      <Card>
        <SignInForm callbackUrl={callbackUrl} initialError={error} />
      </Card>
      <p className="text-sm text-ink-soft">
        <Link href="/forgot-password">Forgot your password?</Link>
      </p>
      <p className="text-sm text-ink-soft">
        New here? <Link href="/register">Create a learner account</Link>.
      </p>
    </div>
  );
}
