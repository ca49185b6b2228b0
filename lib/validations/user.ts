import { z } from 'zod';

export const PASSWORD_MIN = 10;

export const email = z
  .string({ error: 'Enter your e-mail address.' })
  .trim()
  .toLowerCase()
  .min(1, 'Enter your e-mail address.')
  .max(254, 'That e-mail address is too long.')
  .pipe(z.email({ error: 'Enter a valid e-mail address, like name@example.org.' }));

export const password = z
  .string({ error: 'Enter a password.' })
  .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters for your password.`)
  .max(200, 'Use at most 200 characters for your password.');

export const RegisterSchema = z.object({
  name: z.string({ error: 'Enter your name.' }).trim().min(1, 'Enter your name.').max(120, 'Use at most 120 characters for your name.'),
  email,
  password,
});
export type RegisterInput = z.infer<typeof RegisterSchema>;

export const SignInSchema = z.object({
  email,
  password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(200, 'That password is too long.'),
});
export type SignInInput = z.infer<typeof SignInSchema>;

/** `npm run admin:create`: the password is checked by the same policy as a learner's. */
export const AdminCreateSchema = RegisterSchema.extend({ password: password.optional() });
export type AdminCreateInput = z.infer<typeof AdminCreateSchema>;
