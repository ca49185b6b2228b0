import { z } from 'zod';
import { waiverCode } from './waiver';

/** POST /api/enrollments: a workshop, and optionally a fee waiver code. */
export const EnrollSchema = z.object({
  workshopId: z.coerce.number({ error: 'Choose a workshop.' }).int('Choose a workshop.').positive('Choose a workshop.'),
  waiverCode: z
    .union([z.literal(''), z.null(), waiverCode])
    .optional()
    .transform((v) => v || null),
});

/** POST /api/enrollments/[id]/refund (coordinator). */
export const RefundSchema = z.object({
  reason: z
    .string()
    .trim()
    .max(300, 'Use at most 300 characters.')
    .optional()
    .transform((v) => v || null),
});
