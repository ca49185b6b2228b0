import { z } from 'zod';
import { parseOrThrow } from '@/lib/errors';

const quizSlug = z.string().regex(/^[a-z0-9]+(?:-[a-z0-9]+)*--[a-z0-9]+(?:-[a-z0-9]+)*$/, 'Not a quiz name.');
const attemptId = z.coerce.number({ error: 'Not an attempt number.' }).int('Not an attempt number.').positive('Not an attempt number.').max(4_294_967_295);

export const parseQuizSlug = (value: unknown) => parseOrThrow(z.object({ quiz: quizSlug }), { quiz: value }, 'quiz').quiz;
export const parseAttemptId = (value: unknown) => parseOrThrow(z.object({ id: attemptId }), { id: value }, 'attempt').id;
