import { z } from 'zod';

export const WAIVER_CODE = /^[A-Z0-9-]{4,40}$/;

export const waiverCode = z.string().trim().toUpperCase().regex(WAIVER_CODE, 'A waiver code has 4 to 40 letters, digits or dashes.');

/** The coordinator's form for a new fee waiver code. */
export const WaiverSchema = z.object({
  code: z
    .union([z.literal(''), waiverCode])
    .optional()
    .transform((v) => v || null),
  courseId: z.union([z.literal(''), z.null(), z.coerce.number().int().positive()]).transform((v) => (v === '' || v === null ? null : v)),
  maxUses: z.coerce
    .number({ error: 'Enter how many times the code may be used.' })
    .int('Uses must be a whole number.')
    .min(1, 'At least 1 use.')
    .max(1000, 'At most 1,000 uses.'),
  expiresOn: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Enter the last day the code works, as YYYY-MM-DD.'),
  note: z
    .string()
    .trim()
    .max(300, 'Use at most 300 characters for the note.')
    .optional()
    .transform((v) => v || null),
});
export type WaiverInput = z.input<typeof WaiverSchema>;
