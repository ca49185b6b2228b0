'use client';

import Link from 'next/link';
import { FormAlert } from '@/components/ui/form-alert';
import { SubmitButton } from '@/components/ui/submit-button';
import { TextField } from '@/components/ui/text-field';
import { ResetPasswordSchema, type ResetPasswordInput } from '@/lib/validations/account';
import { PASSWORD_MIN } from '@/lib/validations/user';
import { useJsonForm } from './use-json-form';

export function ResetPasswordForm({ token }: { token: string }) {
  const { register, onSubmit, formState, done, failure } = useJsonForm<ResetPasswordInput>(ResetPasswordSchema, '/api/password-reset/complete', {
    defaultValues: { token },
  });
  if (done) {
    return (
      <div aria-live="polite" className="space-y-3">
        <p className="rounded-lg border border-brine-300 bg-brine-50 px-3 py-2 text-sm text-brine-900">{done}</p>
        <Link href="/signin">Sign in</Link>
      </div>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <div aria-live="polite">
        <FormAlert message={failure?.message} />
        {failure?.body.link ? (
          <p className="mt-2 text-sm">
            <Link href="/forgot-password">Ask for a new link</Link>
          </p>
        ) : null}
      </div>
      <input type="hidden" {...register('token')} />
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN} characters. A short sentence is easy to remember.`}
        error={formState.errors.password?.message}
        {...register('password')}
      />
      <SubmitButton pending={formState.isSubmitting} className="w-full">
        Set my new password
      </SubmitButton>
    </form>
  );
}
