'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { SubmitButton } from '@/components/ui/submit-button';
import { TextField } from '@/components/ui/text-field';
import { NewPasswordField } from './new-password-field';
import { RegisterSchema, type RegisterInput } from '@/lib/validations/user';
import { errorMessage, FetchError, postJson } from '@/lib/fetcher';

export function RegisterForm() {
  const router = useRouter();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError } = useForm<RegisterInput>({ resolver: zodResolver(RegisterSchema), mode: 'onTouched' });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await postJson('/api/register', values);
    } catch (e) {
      for (const [field, messages] of Object.entries(e instanceof FetchError ? e.fields : {})) {
        if (field === 'name' || field === 'email' || field === 'password') setError(field, { message: messages[0] });
      }
      setFormError(errorMessage(e, 'We could not create your account. Please try again.'));
      return;
    }
    const result = await signIn('credentials', { redirect: false, email: values.email, password: values.password });
    if (!result || result.error) {
      router.push('/signin');
      return;
    }
    router.push('/pantry');
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <div aria-live="polite">
        {formError ? <p className="rounded-lg border border-beet-500 bg-beet-50 px-3 py-2 text-sm text-beet-700">{formError}</p> : null}
      </div>
      <TextField
        label="Your name"
        autoComplete="name"
        hint="As it should appear on your certificate."
        error={formState.errors.name?.message}
        {...register('name')}
      />
      <TextField label="E-mail" type="email" autoComplete="email" error={formState.errors.email?.message} {...register('email')} />
      <NewPasswordField error={formState.errors.password?.message} {...register('password')} />
      <SubmitButton pending={formState.isSubmitting} className="w-full">
        Create my account
      </SubmitButton>
    </form>
  );
}
