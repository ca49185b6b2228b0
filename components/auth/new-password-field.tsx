import type { ComponentProps } from 'react';
import { TextField } from '@/components/ui/text-field';
import { PASSWORD_MIN } from '@/lib/validations/user';

/** The password a person chooses for a new account, with the sign-up policy as its hint. */
export function NewPasswordField(props: Omit<ComponentProps<typeof TextField>, 'label' | 'type' | 'autoComplete' | 'hint'>) {
  return (
    <TextField
      label="Password"
      type="password"
      autoComplete="new-password"
      hint={`At least ${PASSWORD_MIN} characters. A short sentence is easy to remember.`}
      {...props}
    />
  );
}
