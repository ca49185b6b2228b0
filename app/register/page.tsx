import type { Metadata } from 'next';
import Link from 'next/link';
import { RegisterForm } from '@/components/auth/register-form';
import { Card } from '@/components/ui/card';

export const metadata: Metadata = { title: 'Register' };

export default function RegisterPage() {
  return (
    <div className="mx-auto max-w-md space-y-4">
      <h1 className="text-3xl font-bold">Create your learner account</h1>
      <p className="text-ink-soft">You will use it to read lessons, take quizzes, enroll in a workshop and receive your certificate.</p>
      <Card>
        <RegisterForm />
      </Card>
      <p className="text-sm text-ink-soft">
        Already registered? <Link href="/signin">Sign in</Link>.
      </p>
    </div>
  );
}
