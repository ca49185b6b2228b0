'use client';

import { FormAlert } from '@/components/ui/form-alert';
import { SubmitButton } from '@/components/ui/submit-button';
import { TextField } from '@/components/ui/text-field';
import { ResetRequestSchema, type ResetRequestInput } from '@/lib/validations/account';
import { useJsonForm } from './use-json-form';

export function ForgotPasswordForm() {
  const { register, onSubmit, formState, done, failure } = useJsonForm<ResetRequestInput>(ResetRequestSchema, '/api/password-reset');
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <div aria-live="polite">
        {done ? <p className="rounded-lg border border-brine-300 bg-brine-50 px-3 py-2 text-sm text-brine-900">{done}</p> : null}
        <FormAlert message={failure?.message} />
      </div>
      <TextField label="E-mail" type="email" autoComplete="email" error={formState.errors.email?.message} {...register('email')} />
      <SubmitButton pending={formState.isSubmitting} className="w-full">
        Send me a link
      </SubmitButton>
    </form>
  );
}
