import { z } from 'zod';
import { JAR_SIZES, PRODUCT_IDS } from '@/lib/preserving/products';

// One schema for the learner's practical form and POST /api/practicals, and one for the
// instructor's review form and POST /api/practicals/[id]/review.

export const PACKS = ['raw', 'hot'] as const;
export const PROCESSING_METHODS = ['boiling-water', 'low-temperature-pasteurization'] as const;
export type ProcessingMethod = (typeof PROCESSING_METHODS)[number];
export const PROCESSING_METHOD_LABELS: Record<ProcessingMethod, string> = {
  'boiling-water': 'Boiling-water canner',
  'low-temperature-pasteurization': 'Low-temperature pasteurization (180–185 °F)',
};
export const MIN_PHOTOS = 2;
export const MAX_PHOTOS = 6;

const number = (label: string, min: number, max: number, unit = '') =>
  z
    .number({ error: `Enter the ${label} as a number.` })
    .min(min, `The ${label} must be at least ${min.toLocaleString('en-US')}${unit}.`)
    .max(max, `The ${label} must be at most ${max.toLocaleString('en-US')}${unit}.`);
const whole = (label: string, min: number, max: number, unit = '') => number(label, min, max, unit).int(`Enter the ${label} as a whole number.`);

export const practicalFormSchema = z
  .object({
    product: z.enum(PRODUCT_IDS, { error: 'Choose the product you put up.' }),
    recipeTitle: z.string().trim().min(3, 'Name the tested recipe you followed.').max(200, 'Keep the recipe title under 200 characters.'),
    recipeSource: z
      .string()
      .trim()
      .min(3, 'Say where the recipe is published (book and page, or the web address).')
      .max(300, 'Keep where it is published under 300 characters.'),
    jar: z.enum(JAR_SIZES, { error: 'Choose the jar size.' }),
    jars: whole('number of jars', 1, 30),
    pack: z.enum(PACKS, { error: 'Choose raw or hot pack.' }),
    vinegarAcidityPct: number('vinegar acidity', 0.1, 20, ' %'),
    vinegarMl: number('amount of vinegar', 0, 20_000, ' mL'),
    waterMl: number('amount of water', 0, 20_000, ' mL'),
    // Weighed salt of the brine: fermented pickles are checked by the brine's salt by weight.
    saltG: number('salt in the brine', 0, 5_000, ' g').optional(),
    headspaceIn: number('headspace measured', 0, 3, ' in'),
    method: z.enum(PROCESSING_METHODS, { error: 'Choose the processing method.' }),
    // Below sea level is allowed (the lowest band applies); the lowest dry land is about -1,410 ft.
    altitudeFt: whole('altitude', -1_500, 14_000, ' ft'),
    minutes: whole('minutes processed', 0, 240),
    batchDate: z.iso
      .date({ error: 'Enter the date you put up the batch.' })
      // A day of slack for time zones ahead of UTC.
      .refine((value) => value <= new Date(Date.now() + 86_400_000).toISOString().slice(0, 10), 'The batch date cannot be in the future.')
      .refine((value) => value >= '2000-01-01', 'Enter the date you put up the batch.'),
    sealedJars: whole('number of sealed jars', 0, 30),
    unsealedJars: whole('number of jars that did not seal', 0, 30),
    notes: z.string().trim().max(2000, 'Keep the notes under 2,000 characters.').default(''),
    photoIds: z
      .array(z.number().int().positive())
      .min(MIN_PHOTOS, `Add at least ${MIN_PHOTOS} photos: packed jars with the headspace visible, jars after processing and a lid close-up.`)
      .max(MAX_PHOTOS, `Add at most ${MAX_PHOTOS} photos.`)
      .refine((ids) => new Set(ids).size === ids.length, 'Each photo can be added once.'),
  })
  .refine((v) => v.sealedJars + v.unsealedJars === v.jars, {
    path: ['unsealedJars'],
    message: 'Sealed and not-sealed jars should add up to the number of jars.',
  })
  .refine((v) => v.vinegarMl > 0, { path: ['vinegarMl'], message: 'Enter the amount of vinegar in the brine (pickles need acid).' });

export type PracticalForm = z.infer<typeof practicalFormSchema>;
export type PracticalFormInput = z.input<typeof practicalFormSchema>;
/** What is kept as the practical's details: the form without the photo ids. */
export type PracticalDetails = Omit<PracticalForm, 'photoIds'>;

export const practicalSubmissionSchema = z.object({
  course: z.string().regex(/^[a-z0-9-]{1,80}$/, 'Unknown course.'),
  practical: practicalFormSchema,
});

// The rubric an instructor fills in for each round.
export const RUBRIC_CRITERIA = [
  { id: 'rims-and-lids', label: 'Clean rims and proper lids' },
  { id: 'headspace', label: 'Headspace as the recipe gives' },
  { id: 'liquid-covers', label: 'Liquid covering the produce' },
  { id: 'no-siphoning', label: 'No siphoning or broken jars' },
  { id: 'colour-texture', label: 'Colour and texture as expected' },
  { id: 'labelled', label: 'Labelled with product and date' },
] as const;
export type RubricCriterionId = (typeof RUBRIC_CRITERIA)[number]['id'];

const criterion = z
  .object({
    verdict: z.enum(['met', 'not_met'], { error: 'Choose met or not met.' }),
    comment: z.string().trim().max(500, 'Keep the comment under 500 characters.').default(''),
  })
  .refine((c) => c.verdict === 'met' || c.comment.length >= 3, { path: ['comment'], message: 'Say what is wrong when a criterion is not met.' });

export const reviewSchema = z
  .object({
    decision: z.enum(['approved', 'changes_requested'], { error: 'Choose to pass this batch or ask for another batch.' }),
    rubric: z.object(Object.fromEntries(RUBRIC_CRITERIA.map((c) => [c.id, criterion])) as Record<RubricCriterionId, typeof criterion>),
    comment: z.string().trim().max(2000, 'Keep the comment under 2,000 characters.').default(''),
  })
  .superRefine((review, ctx) => {
    if (review.decision === 'approved' && Object.values(review.rubric).some((c) => c.verdict !== 'met')) {
      ctx.addIssue({ code: 'custom', path: ['decision'], message: 'Approve only when every criterion is met; otherwise ask for changes.' });
    }
    if (review.decision === 'changes_requested' && review.comment.length < 10) {
      ctx.addIssue({ code: 'custom', path: ['comment'], message: 'Say what the learner should change (at least 10 characters).' });
    }
  });

export type ReviewInput = z.infer<typeof reviewSchema>;

// The Tasting table's query string (GET /api/tasting-table/submissions).
export const TASTING_SORTS = ['oldest', 'newest', 'learner', 'flags', 'status'] as const;
export type TastingSort = (typeof TASTING_SORTS)[number];
export const TASTING_PAGE_SIZE = 20;
const emptyToUndefined = (v: unknown) => (v === '' || v === null ? undefined : v);

export const tastingTableQuerySchema = z.object({
  page: z.preprocess(emptyToUndefined, z.coerce.number().int().min(1).max(10_000).default(1)),
  sort: z.preprocess(emptyToUndefined, z.enum(TASTING_SORTS).default('oldest')),
  status: z.preprocess(emptyToUndefined, z.enum(['all', 'submitted', 'changes_requested', 'approved']).default('all')),
  workshop: z.preprocess(emptyToUndefined, z.coerce.number().int().positive().optional()),
  flagged: z.preprocess(emptyToUndefined, z.enum(['any', 'yes', 'no']).default('any')),
  /** Only submissions waiting at least this many days. */
  olderThanDays: z.preprocess(emptyToUndefined, z.coerce.number().int().min(0).max(3650).optional()),
});
export type TastingTableQuery = z.infer<typeof tastingTableQuerySchema>;
