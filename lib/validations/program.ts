import { z } from 'zod';

const optional = (max: number, label: string) =>
  z.preprocess(
    (v) => (typeof v === 'string' && v.trim() === '' ? null : v),
    z.string().trim().max(max, `Use at most ${max} characters for the ${label}.`).nullable().default(null),
  );

/** An IANA time-zone name the runtime knows (workshop times and dates are shown in it). */
export const timeZone = z
  .string({ error: 'Choose a time zone.' })
  .trim()
  .min(1, 'Choose a time zone.')
  .max(64)
  .refine((zone) => {
    try {
      new Intl.DateTimeFormat('en-US', { timeZone: zone });
      return true;
    } catch {
      return false;
    }
  }, 'Use a time-zone name such as America/Denver.');

export const ProgramSettingsSchema = z.object({
  name: z.string({ error: 'Enter the program’s name.' }).trim().min(1, 'Enter the program’s name.').max(200, 'Use at most 200 characters for the name.'),
  shortName: z.string({ error: 'Enter a short name.' }).trim().min(1, 'Enter a short name.').max(40, 'Use at most 40 characters for the short name.'),
  contactEmail: z.preprocess(
    (v) => (typeof v === 'string' && v.trim() === '' ? null : v),
    z
      .string()
      .trim()
      .toLowerCase()
      .max(254)
      .pipe(z.email({ error: 'Enter a valid e-mail address, like name@example.org.' }))
      .nullable()
      .default(null),
  ),
  contactPhone: optional(40, 'phone number').refine((v) => v === null || /^[0-9+()\-.\s]{3,40}$/.test(v), 'Use digits, spaces and + ( ) - . only.'),
  postalAddress: optional(500, 'postal address'),
  timeZone,
});
export type ProgramSettingsInput = z.infer<typeof ProgramSettingsSchema>;
