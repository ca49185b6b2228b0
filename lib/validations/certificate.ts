import { z } from 'zod';
import { ENROLLMENT_STATUSES } from '@/lib/enrollment-status';

// The certificate desk's inputs, shared by its client components and its route handlers.

export const IssueSchema = z.object({
  enrollmentIds: z.array(z.number().int().positive()).min(1, 'Select at least one enrollment.').max(100, 'Issue at most 100 at a time.'),
});
export type IssueInput = z.infer<typeof IssueSchema>;

export const RevokeSchema = z.object({
  reason: z.string().trim().min(5, 'Give a reason of at least 5 characters.').max(500, 'Keep the reason under 500 characters.'),
});
export type RevokeInput = z.infer<typeof RevokeSchema>;

const optionalId = z.preprocess((v) => (v === '' || v === null ? undefined : v), z.coerce.number().int().positive().optional());

export const DeskFilterSchema = z.object({
  course: z.preprocess(
    (v) => (v === '' ? undefined : v),
    z
      .string()
      .max(80)
      .regex(/^[a-z0-9-]+$/)
      .optional(),
  ),
  workshop: optionalId,
  status: z.preprocess((v) => (v === '' ? undefined : v), z.enum(ENROLLMENT_STATUSES).optional()),
  eligible: z.preprocess((v) => (v === '' ? undefined : v), z.enum(['yes', 'no', 'certified']).optional()),
  q: z.preprocess((v) => (v === '' ? undefined : v), z.string().trim().max(100).optional()),
});
export type DeskFilter = z.infer<typeof DeskFilterSchema>;

export const DeskQuerySchema = DeskFilterSchema.extend({
  page: z.coerce.number().int().positive().max(10_000).default(1),
  pageSize: z.coerce.number().int().min(5).max(100).default(25),
});
export type DeskQuery = z.infer<typeof DeskQuerySchema>;

/** Body of POST /api/certificates/refresher: the refresher enrollment whose certificate the learner claims. */
export const RefresherClaimSchema = z.object({ enrollmentId: z.number().int().positive() });

export const SerialParamSchema = z.string().trim().min(1).max(40);

/** A correction of an issued certificate: why, and the holder's name as it should read (default: the account's name today). */
export const ReissueSchema = z.object({
  reason: z
    .string({ error: 'Say what the correction is.' })
    .trim()
    .min(5, 'Give a reason of at least 5 characters.')
    .max(500, 'Keep the reason under 500 characters.'),
  holderName: z.preprocess(
    (v) => (v === '' || v === null ? undefined : v),
    z.string().trim().min(1).max(120, 'Use at most 120 characters for the name.').optional(),
  ),
});
export type ReissueInput = z.infer<typeof ReissueSchema>;
