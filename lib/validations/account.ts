import { z } from 'zod';
import { email, password, RegisterSchema } from './user';

const token = z.string({ error: 'The link is incomplete.' }).min(1, 'The link is incomplete.').max(200, 'The link is not valid.');
const currentPassword = z.string({ error: 'Enter your present password.' }).min(1, 'Enter your present password.').max(200, 'That password is too long.');

export const ResetRequestSchema = z.object({ email });
export type ResetRequestInput = z.infer<typeof ResetRequestSchema>;

export const ResetPasswordSchema = z.object({ token, password });
export type ResetPasswordInput = z.infer<typeof ResetPasswordSchema>;

export const ChangePasswordSchema = z
  .object({ currentPassword, newPassword: password })
  .refine((v) => v.currentPassword !== v.newPassword, { path: ['newPassword'], message: 'Choose a password different from the present one.' });
export type ChangePasswordInput = z.infer<typeof ChangePasswordSchema>;

export const ChangeEmailSchema = z.object({ newEmail: email, currentPassword });
export type ChangeEmailInput = z.infer<typeof ChangeEmailSchema>;

export const ChangeNameSchema = RegisterSchema.pick({ name: true });
export type ChangeNameInput = z.infer<typeof ChangeNameSchema>;

/** A deliberate click: the body must say so, so a stray request ends nothing. */
export const SignOutEverywhereSchema = z.object({ confirm: z.literal(true, { error: 'Confirm that every session should end.' }) });

export const DeleteAccountSchema = z.object({
  currentPassword,
  confirm: z.literal('DELETE', { error: 'Type DELETE to confirm.' }),
});
export type DeleteAccountInput = z.infer<typeof DeleteAccountSchema>;
