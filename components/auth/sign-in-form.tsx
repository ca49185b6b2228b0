'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { SubmitButton } from '@/components/ui/submit-button';
import { TextField } from '@/components/ui/text-field';
import { callbackPath } from '@/lib/auth/callback-url';
import { SignInSchema, type SignInInput } from '@/lib/validations/user';

const MESSAGES: Record<string, string> = {
  CredentialsSignin: 'That e-mail address and password do not match an account.',
  Throttled: 'Too many sign-in attempts. Please wait a few minutes and try again.',
};

export function SignInForm({ callbackUrl, initialError }: { callbackUrl?: string; initialError?: string }) {
  const router = useRouter();
  const [formError, setFormError] = useState<string | null>(initialError ? (MESSAGES[initialError] ?? MESSAGES.CredentialsSignin) : null);
  const { register, handleSubmit, formState } = useForm<SignInInput>({ resolver: zodResolver(SignInSchema), mode: 'onTouched' });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    const result = await signIn('credentials', { redirect: false, email: values.email, password: values.password });
    if (!result || result.error) {
      setFormError(MESSAGES[result?.error ?? ''] ?? MESSAGES.CredentialsSignin);
      return;
    }
    router.push(callbackPath(callbackUrl, window.location.origin));
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-describedby={formError ? 'signin-error' : undefined}>
      <div id="signin-error" aria-live="polite">
        {formError ? <p className="rounded-lg border border-beet-500 bg-beet-50 px-3 py-2 text-sm text-beet-700">{formError}</p> : null}
      </div>
      <TextField label="E-mail" type="email" autoComplete="email" error={formState.errors.email?.message} {...register('email')} />
      <TextField label="Password" type="password" autoComplete="current-password" error={formState.errors.password?.message} {...register('password')} />
      <SubmitButton pending={formState.isSubmitting} className="w-full">
        Sign in
      </SubmitButton>
    </form>
  );
}
