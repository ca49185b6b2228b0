import { z } from 'zod';

/** A correction of an issued certificate: why, and the holder's name as it should read (default: the account's name today). */
export const ReissueSchema = z.object({
  reason: z.string({ error: 'Say what the correction is.' }).trim().min(5, 'Give a reason of at least 5 characters.').max(500, 'Keep the reason under 500 characters.'),
  holderName: z.preprocess((v) => (v === '' || v === null ? undefined : v), z.string().trim().min(1).max(120, 'Use at most 120 characters for the name.').optional()),
});
export type ReissueInput = z.infer<typeof ReissueSchema>;
