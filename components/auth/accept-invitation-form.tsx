'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { FormAlert } from '@/components/ui/form-alert';
import { SubmitButton } from '@/components/ui/submit-button';
import { TextField } from '@/components/ui/text-field';
import { NewPasswordField } from './new-password-field';
import { errorMessage, FetchError, postJson } from '@/lib/fetcher';
import { AcceptInvitationSchema, type AcceptInvitationInput } from '@/lib/validations/invitation';

/** The invitee chooses a name and a password; the account then signs in at once. */
export function AcceptInvitationForm({ token, email, home }: { token: string; email: string; home: string }) {
  const router = useRouter();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<AcceptInvitationInput>({
    resolver: zodResolver(AcceptInvitationSchema),
    mode: 'onTouched',
    defaultValues: { token },
  });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await postJson('/api/invitations/accept', values);
    } catch (e) {
      // The server's field errors go beside their fields; anything else (a used or expired link) above the form.
      const fields = e instanceof FetchError ? e.fields : {};
      if (fields.name) setError('name', { message: fields.name[0] });
      if (fields.password) setError('password', { message: fields.password[0] });
      setFormError(errorMessage(e, 'We could not create your account. Please try again.'));
      return;
    }
    const result = await signIn('credentials', { redirect: false, email, password: values.password });
    router.push(!result || result.error ? '/signin' : home);
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <FormAlert message={formError} />
      <input type="hidden" {...register('token')} />
      <TextField
        label="Your name"
        autoComplete="name"
        hint="As it should appear to learners and on certificates you sign."
        error={formState.errors.name?.message}
        {...register('name')}
      />
      <NewPasswordField error={formState.errors.password?.message} {...register('password')} />
      <SubmitButton pending={formState.isSubmitting} className="w-full">
        Create my account
      </SubmitButton>
    </form>
  );
}
