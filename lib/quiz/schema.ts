import { z } from 'zod';

// The shape of a question bank, content/quizzes/<quiz-slug>.json, checked when it loads.
// The answer key lives in these files and is read on the server only.

const id = z.string().regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, 'use lowercase letters, digits and hyphens');
const text = z.string().trim().min(1, 'must not be empty');
const quizSlug = z.string().regex(/^[a-z0-9]+(?:-[a-z0-9]+)*--[a-z0-9]+(?:-[a-z0-9]+)*$/, 'use "<course>--<name>"');

const choice = z.object({ id, text }).strict();

const base = {
  id,
  prompt: text,
  explanation: text,
};

/** Names of lib/preserving functions a numeric question may take its expected answer from. */
export const COMPUTE_NAMES = ['processingTime', 'pressureForAltitude', 'boilingPoint', 'headspaceCheck', 'saltForBrine', 'brineAcidity', 'convert'] as const;
export type ComputeName = (typeof COMPUTE_NAMES)[number];

export const computeSchema = z
  .object({
    compute: z.enum(COMPUTE_NAMES),
    args: z.union([z.record(z.string(), z.unknown()), z.array(z.unknown())]),
    field: z.string().min(1).optional(),
  })
  .strict();
export type ComputeSpec = z.infer<typeof computeSchema>;

const singleQuestion = z
  .object({ ...base, kind: z.literal('single'), choices: z.array(choice).min(2).max(8), answer: id })
  .strict()
  .refine((q) => q.choices.some((c) => c.id === q.answer), { message: 'the answer must be one of the choices', path: ['answer'] });

const multipleQuestion = z
  .object({ ...base, kind: z.literal('multiple'), choices: z.array(choice).min(3).max(8), answer: z.array(id).min(1) })
  .strict()
  .refine((q) => q.answer.every((a) => q.choices.some((c) => c.id === a)), { message: 'every answer must be one of the choices', path: ['answer'] });

const trueFalseQuestion = z.object({ ...base, kind: z.literal('true-false'), answer: z.boolean() }).strict();

/** Units a numeric answer may be given in; the first of `units` is the one the question asks for. */
export const NUMERIC_UNITS = [
  'min',
  'psi',
  'F',
  'C',
  'in',
  'g',
  'oz',
  'lb',
  'kg',
  'mL',
  'L',
  'cup',
  'tbsp',
  'tsp',
  'fl-oz',
  'pint',
  'quart',
  'gallon',
  'ft',
  'm',
  '%',
  'pH',
] as const;
export type NumericUnit = (typeof NUMERIC_UNITS)[number];

const numericQuestion = z
  .object({
    ...base,
    kind: z.literal('numeric'),
    units: z.array(z.enum(NUMERIC_UNITS)).min(1),
    answer: z.union([z.number().finite(), computeSchema]),
    tolerance: z
      .object({ abs: z.number().nonnegative().optional(), pct: z.number().nonnegative().max(50).optional() })
      .strict()
      .default({ abs: 0 }),
    decimals: z.number().int().min(0).max(4).optional(),
  })
  .strict();

export const questionSchema = z.union([singleQuestion, multipleQuestion, trueFalseQuestion, numericQuestion]);

export const bankFileSchema = z
  .object({
    slug: quizSlug,
    course: id,
    lesson: id.optional(),
    title: text,
    description: text.optional(),
    /** How many questions one attempt draws; all when omitted. */
    draw: z.number().int().positive().optional(),
    /** At most `max` attempts started in any `windowHours`. */
    attemptLimit: z.object({ max: z.number().int().positive(), windowHours: z.number().positive() }).strict().optional(),
    timeLimitMinutes: z.number().int().positive().max(600).optional(),
    /** Other banks whose questions join this one (the final exam draws from the lesson quizzes). */
    include: z.array(quizSlug).default([]),
    questions: z.array(questionSchema).default([]),
  })
  .strict();

export type BankFile = z.infer<typeof bankFileSchema>;
export type Question = z.infer<typeof questionSchema>;
export type NumericQuestion = Extract<Question, { kind: 'numeric' }>;
export type ChoiceQuestion = Extract<Question, { kind: 'single' | 'multiple' }>;

/** A numeric question whose expected value has been resolved to a number. */
export type ResolvedQuestion = Exclude<Question, NumericQuestion> | (Omit<NumericQuestion, 'answer'> & { answer: number; computedFrom?: ComputeSpec });

/** A bank ready to use: includes merged, numeric answers resolved, limits defaulted. */
export type Bank = {
  slug: string;
  course: string;
  lesson?: string;
  title: string;
  description?: string;
  draw: number;
  attemptLimit: { max: number; windowHours: number } | null;
  timeLimitMinutes: number | null;
  questions: ResolvedQuestion[];
};
