import { z } from 'zod';
import { email } from './user';

export const HOLDER_COLUMNS = ['name', 'email', 'course', 'certificate_date', 'end_date', 'old_serial'] as const;
export const REQUIRED_HOLDER_COLUMNS = ['name', 'email', 'course', 'certificate_date', 'end_date'] as const;

const day = (label: string) =>
  z
    .string()
    .trim()
    .regex(/^\d{4}-\d{2}-\d{2}$/, `${label}: write the date as YYYY-MM-DD`)
    .refine((v) => !Number.isNaN(Date.parse(`${v}T00:00:00Z`)) && new Date(`${v}T00:00:00Z`).toISOString().startsWith(v), `${label}: not a calendar date`);

/** One line of a certificate-holder file, after the CSV parser has split it into named columns. */
export const HolderLineSchema = z
  .object({
    name: z.string().trim().min(1, 'name: empty').max(120, 'name: longer than 120 characters'),
    email: email,
    course: z.string().trim().min(1, 'course: empty').max(80),
    certificate_date: day('certificate_date'),
    end_date: day('end_date'),
    old_serial: z.preprocess(
      (v) => (typeof v === 'string' && v.trim() === '' ? null : v),
      z.string().trim().max(40, 'old_serial: longer than 40 characters').nullable().default(null),
    ),
  })
  .refine((l) => l.end_date > l.certificate_date, { message: 'end_date: must be after certificate_date', path: ['end_date'] });
export type HolderLine = z.infer<typeof HolderLineSchema>;

/** The text of the uploaded file, at most 2 MB (about 10,000 holders). */
export const HolderFileSchema = z.string().min(1, 'The file is empty.').max(2_000_000, 'The file is larger than 2 MB: split it.');

/** The body of the import routes: the file's text, read in the browser. */
export const HolderImportSchema = z.object({ text: HolderFileSchema });
