'use client';

import Link from 'next/link';
import { signIn, signOut } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { SubmitButton } from '@/components/ui/submit-button';
import { TextField } from '@/components/ui/text-field';
import { errorMessage, FetchError, postJson } from '@/lib/fetcher';
import {
  ChangeEmailSchema,
  ChangeNameSchema,
  ChangePasswordSchema,
  DeleteAccountSchema,
  type ChangeEmailInput,
  type ChangeNameInput,
  type ChangePasswordInput,
  type DeleteAccountInput,
} from '@/lib/validations/account';
import { PASSWORD_MIN } from '@/lib/validations/user';
import { useJsonForm } from './use-json-form';

function Outcome({ done, failure }: { done: string | null; failure: string | null | undefined }) {
  return (
    <div aria-live="polite">
      {done ? <p className="rounded-lg border border-brine-300 bg-brine-50 px-3 py-2 text-sm text-brine-900">{done}</p> : null}
      <FormAlert message={failure} />
    </div>
  );
}

/** The present password, which every change to the account asks for. */
function PresentPassword({ label = 'Present password', error, ...field }: UseFormRegisterReturn & { label?: string; error?: string }) {
  return <TextField label={label} type="password" autoComplete="current-password" error={error} {...field} />;
}

export function NameForm({ name }: { name: string }) {
  const [advice, setAdvice] = useState<string | null>(null);
  const router = useRouter();
  const { register, onSubmit, formState, done, failure } = useJsonForm<ChangeNameInput>(ChangeNameSchema, '/api/account/name', {
    defaultValues: { name },
    onDone: (body) => {
      setAdvice(typeof body.reissueAdvice === 'string' ? body.reissueAdvice : null);
      router.refresh();
    },
  });
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <Outcome done={done ? (advice ? `Your name is saved. ${advice}` : 'Your name is saved.') : null} failure={failure?.message} />
      <TextField
        label="Name on certificates"
        autoComplete="name"
        hint="As it should print on certificates issued from now on."
        error={formState.errors.name?.message}
        {...register('name')}
      />
      <SubmitButton pending={formState.isSubmitting}>Save my name</SubmitButton>
    </form>
  );
}

export function PasswordForm({ email }: { email: string }) {
  const router = useRouter();
  const { register, onSubmit, formState, done, failure, reset } = useJsonForm<ChangePasswordInput>(ChangePasswordSchema, '/api/account/password', {
    // Every session ended, this one too: sign this browser in again with the new password.
    onDone: async (_body, values) => {
      await signIn('credentials', { redirect: false, email, password: values.newPassword });
      reset({ currentPassword: '', newPassword: '' });
      router.refresh();
    },
  });
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <Outcome done={done} failure={failure?.message} />
      <PresentPassword error={formState.errors.currentPassword?.message} {...register('currentPassword')} />
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN} characters. Every other session of your account is signed out.`}
        error={formState.errors.newPassword?.message}
        {...register('newPassword')}
      />
      <SubmitButton pending={formState.isSubmitting}>Change my password</SubmitButton>
    </form>
  );
}

export function EmailForm() {
  const { register, onSubmit, formState, done, failure } = useJsonForm<ChangeEmailInput>(ChangeEmailSchema, '/api/account/email');
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <Outcome done={done} failure={failure?.message} />
      <TextField label="New e-mail address" type="email" autoComplete="email" error={formState.errors.newEmail?.message} {...register('newEmail')} />
      <PresentPassword label="Present password for the e-mail change" error={formState.errors.currentPassword?.message} {...register('currentPassword')} />
      <SubmitButton pending={formState.isSubmitting}>Send a confirmation link</SubmitButton>
    </form>
  );
}

/** One button that posts to a route and shows its sentence; `after` runs on success. */
function ActionButton({
  url,
  body,
  label,
  after,
  variant,
}: {
  url: string;
  body?: unknown;
  label: string;
  after?: () => Promise<void>;
  variant?: 'secondary';
}) {
  const [pending, setPending] = useState(false);
  const [done, setDone] = useState<string | null>(null);
  const [failure, setFailure] = useState<FetchError | string | null>(null);
  const click = async () => {
    setPending(true);
    setDone(null);
    setFailure(null);
    try {
      const answer = await postJson<{ message?: string }>(url, body);
      setDone(answer.message ?? 'Done.');
      await after?.();
    } catch (e) {
      setFailure(e instanceof FetchError ? e : errorMessage(e, 'Something went wrong. Please try again.'));
    } finally {
      setPending(false);
    }
  };
  const signedOut = failure instanceof FetchError && failure.status === 401;
  return (
    <div className="space-y-2">
      <Button variant={variant} pending={pending} onClick={click}>
        {label}
      </Button>
      <Outcome done={done} failure={typeof failure === 'string' ? failure : failure?.message} />
      {signedOut ? (
        <p className="text-sm">
          <Link href="/signin?callbackUrl=%2Faccount">Sign in</Link> first, then send it from your account page.
        </p>
      ) : null}
    </div>
  );
}

export function ResendConfirmation() {
  return <ActionButton url="/api/account/confirmation" label="Send the confirmation e-mail again" variant="secondary" />;
}

export function SignOutEverywhere() {
  return (
    <ActionButton
      url="/api/account/sign-out-everywhere"
      body={{ confirm: true }}
      label="Sign out everywhere"
      variant="secondary"
      after={() => signOut({ callbackUrl: '/signin' })}
    />
  );
}

export function DeleteAccountForm() {
  const { register, onSubmit, formState, done, failure } = useJsonForm<DeleteAccountInput>(DeleteAccountSchema, '/api/account', {
    method: 'DELETE',
    onDone: () => signOut({ callbackUrl: '/' }),
  });
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <Outcome done={done} failure={failure?.message} />
      <PresentPassword error={formState.errors.currentPassword?.message} {...register('currentPassword')} />
      <TextField label="Type DELETE to confirm" autoComplete="off" error={formState.errors.confirm?.message} {...register('confirm')} />
      <SubmitButton pending={formState.isSubmitting}>Delete my account</SubmitButton>
    </form>
  );
}
