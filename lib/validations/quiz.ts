import { z } from 'zod';
import { NUMERIC_UNITS } from '@/lib/quiz/schema';

/** The body of POST /api/attempts/[id]/submit. */
export const SubmitSchema = z
  .object({
    answers: z.record(
      z.string().min(1).max(120),
      z.union([
        z.string().min(1).max(20),
        z.array(z.string().min(1).max(20)).max(12),
        z.boolean(),
        z.object({ value: z.number({ error: 'Give a number.' }).finite(), unit: z.enum(NUMERIC_UNITS, { error: 'Choose a unit.' }) }).strict(),
      ]),
    ),
  })
  .strict();
export type SubmitInput = z.infer<typeof SubmitSchema>;
