'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useMemo, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { Card } from '@/components/ui/card';
import { Select } from '@/components/ui/select';
import { FormAlert } from '@/components/ui/form-alert';
import { SubmitButton } from '@/components/ui/submit-button';
import { FieldError, TextArea, TextField } from '@/components/ui/text-field';
import { checkInputsFor, checkPractical, type CheckInput, type Flag } from '@/lib/practicals/checks';
import { JAR_SIZES, PRODUCT_OPTIONS } from '@/lib/preserving/products';
import {
  PROCESSING_METHOD_LABELS,
  PROCESSING_METHODS,
  practicalFormSchema,
  type PracticalForm as FormValues,
  type PracticalFormInput,
} from '@/lib/validations/practical';
import { batchName } from '@/lib/practicals/words';
import { FlagList } from './flag-list';
import { PhotoUploader } from './photo-uploader';
import { errorMessage, FetchError, postJson } from '@/lib/fetcher';

const JAR_OPTIONS = [
  { value: '', label: 'Choose a jar size' },
  ...JAR_SIZES.map((j) => ({ value: j, label: j === 'half-pint' ? 'Half-pint' : j[0].toUpperCase() + j.slice(1) })),
];
const PRODUCTS = [{ value: '', label: 'Choose the product' }, ...PRODUCT_OPTIONS];
const PACK_OPTIONS = [
  { value: '', label: 'Choose raw or hot pack' },
  { value: 'raw', label: 'Raw pack' },
  { value: 'hot', label: 'Hot pack' },
];
const METHOD_OPTIONS = [{ value: '', label: 'Choose the method' }, ...PROCESSING_METHODS.map((m) => ({ value: m, label: PROCESSING_METHOD_LABELS[m] }))];

type Result = { id: number; round: number; flags: Flag[] };

/** The form's label of each field the automatic checks read. */
const CHECK_INPUT_LABELS: Record<CheckInput, string> = {
  product: 'Product',
  pack: 'Pack',
  jar: 'Jar size',
  headspaceIn: 'Headspace measured',
  vinegarAcidityPct: 'Vinegar acidity',
  vinegarMl: 'Vinegar used',
  waterMl: 'Water used',
  saltG: 'Salt in the brine',
  method: 'Processing method',
  altitudeFt: 'Altitude',
  minutes: 'Minutes processed',
  unsealedJars: 'Jars not sealed',
};

/** The learner's practical batch: details, photos, and the automatic checks shown as they type. */
/**
 * The form for the next round, in its card. The page renders it in the same place whether or not
 * a round may be submitted (`open`), so that after a submission the refreshed page (which no longer
 * offers the form) keeps this component, and its confirmation with the flags, on screen.
 */
export function PracticalForm({ courseSlug, round, open, title }: { courseSlug: string; round: number; open: boolean; title: string }) {
  const router = useRouter();
  const [serverError, setServerError] = useState<string | null>(null);
  const [result, setResult] = useState<Result | null>(null);
  const {
    register,
    handleSubmit,
    setValue,
    setError,
    control,
    formState: { errors, isSubmitting },
  } = useForm<PracticalFormInput, unknown, FormValues>({
    resolver: zodResolver(practicalFormSchema),
    mode: 'onTouched',
    defaultValues: { notes: '', photoIds: [], vinegarAcidityPct: 5 },
  });
  const values = useWatch({ control });
  // The same checks the server runs on submit, on whatever is entered so far.
  const flags = useMemo(() => checkPractical(values as Parameters<typeof checkPractical>[0]), [values]);
  // The fields the checks read that are still empty: until they are entered, "no flags" means
  // "nothing checked yet", and the box says which ones.
  const notChecked = checkInputsFor(values.product)
    .filter((name) => {
      const v = (values as Record<string, unknown>)[name];
      return v === undefined || v === null || v === '' || (typeof v === 'number' && Number.isNaN(v));
    })
    .map((name) => CHECK_INPUT_LABELS[name]);

  const onSubmit = async (form: FormValues) => {
    setServerError(null);
    try {
      const body = await postJson<{ practical: typeof result }>('/api/practicals', { course: courseSlug, practical: form });
      setResult(body.practical);
      router.refresh();
    } catch (e) {
      for (const [key, messages] of Object.entries(e instanceof FetchError ? e.fields : {})) {
        setError(key.replace(/^practical\./, '') as keyof PracticalFormInput, { message: messages[0] });
      }
      setServerError(errorMessage(e, 'Your batch could not be sent. Please try again.'));
    }
  };

  if (result) {
    return (
      <Card className="space-y-4" data-testid="practical-submitted">
        <div role="status" className="rounded-jar border border-brine-300 bg-brine-50 p-4">
          <h2 className="text-lg font-bold">Your {batchName(result.round)} is at the Tasting table</h2>
          <p className="text-sm text-ink-soft">An instructor will look at your batch and photos. You will get an e-mail when they have.</p>
        </div>
        <FlagList flags={result.flags} title="What the instructor will double-check" />
      </Card>
    );
  }
  if (!open) return null;

  const num = { valueAsNumber: true } as const;
  return (
    <Card title={title}>
      <form onSubmit={handleSubmit(onSubmit)} noValidate className="space-y-6" aria-describedby="practical-form-intro">
        <p id="practical-form-intro" className="text-sm text-ink-soft">
          {round > 1 ? `This is your ${batchName(round)}. ` : ''}Enter what you actually did. Something to double-check does not stop you from sending: it tells
          you and your instructor where the batch differs from the published numbers.
        </p>

        <fieldset className="grid gap-4 md:grid-cols-2">
          <legend className="mb-2 font-display text-lg font-bold">The recipe</legend>
          <Select label="Product" options={PRODUCTS} error={errors.product?.message} {...register('product')} />
          <Select label="Pack" options={PACK_OPTIONS} error={errors.pack?.message} {...register('pack')} />
          <TextField label="Tested recipe followed" hint="Its title" error={errors.recipeTitle?.message} {...register('recipeTitle')} />
          <TextField
            label="Where it is published"
            hint="Book and page, or the web address"
            error={errors.recipeSource?.message}
            {...register('recipeSource')}
          />
        </fieldset>

        <fieldset className="grid gap-4 md:grid-cols-3">
          <legend className="mb-2 font-display text-lg font-bold">Jars and brine</legend>
          <Select label="Jar size" options={JAR_OPTIONS} error={errors.jar?.message} {...register('jar')} />
          <TextField label="Number of jars" type="number" inputMode="numeric" min={1} error={errors.jars?.message} {...register('jars', num)} />
          <TextField
            label="Headspace measured"
            hint="Inches, e.g. 0.5 for ½ inch"
            type="number"
            step="0.0625"
            min={0}
            suffix="in"
            error={errors.headspaceIn?.message}
            {...register('headspaceIn', num)}
          />
          <TextField
            label="Vinegar acidity"
            hint="From the label"
            type="number"
            step="0.1"
            min={0}
            suffix="%"
            error={errors.vinegarAcidityPct?.message}
            {...register('vinegarAcidityPct', num)}
          />
          <TextField
            label="Vinegar used"
            hint="1 cup = 237 mL"
            type="number"
            step="any"
            min={0}
            suffix="mL"
            error={errors.vinegarMl?.message}
            {...register('vinegarMl', num)}
          />
          <TextField
            label="Water used"
            hint="In the brine"
            type="number"
            step="any"
            min={0}
            suffix="mL"
            error={errors.waterMl?.message}
            {...register('waterMl', num)}
          />
          {values.product === 'fermented-dill-pickles' ? (
            <TextField
              label="Salt in the brine"
              hint="Weighed; fermented pickles are checked by salt by weight"
              type="number"
              step="any"
              min={0}
              suffix="g"
              error={errors.saltG?.message}
              {...register('saltG', { setValueAs: (v) => (v === '' || v === null || v === undefined ? undefined : Number(v)) })}
            />
          ) : null}
        </fieldset>

        <fieldset className="grid gap-4 md:grid-cols-3">
          <legend className="mb-2 font-display text-lg font-bold">Processing</legend>
          <Select label="Processing method" options={METHOD_OPTIONS} error={errors.method?.message} {...register('method')} />
          <TextField
            label="Altitude"
            hint="Of your kitchen, in feet (1 m = 3.28 ft); below sea level is negative"
            type="number"
            inputMode="numeric"
            min={-1500}
            suffix="ft"
            error={errors.altitudeFt?.message}
            {...register('altitudeFt', num)}
          />
          <TextField
            label="Minutes processed"
            hint="Counted from the return to a full boil"
            type="number"
            inputMode="numeric"
            min={0}
            suffix="min"
            error={errors.minutes?.message}
            {...register('minutes', num)}
          />
          <TextField label="Date put up" type="date" error={errors.batchDate?.message} {...register('batchDate')} />
          <TextField
            label="Jars sealed"
            hint="After 12–24 hours"
            type="number"
            inputMode="numeric"
            min={0}
            error={errors.sealedJars?.message}
            {...register('sealedJars', num)}
          />
          <TextField
            label="Jars not sealed"
            type="number"
            inputMode="numeric"
            min={0}
            error={errors.unsealedJars?.message}
            {...register('unsealedJars', num)}
          />
        </fieldset>

        <TextArea label="Notes" id="practical-notes" error={errors.notes?.message} {...register('notes')} />

        <div>
          <PhotoUploader
            courseSlug={courseSlug}
            onChange={(ids) => setValue('photoIds', ids, { shouldValidate: ids.length > 0 })}
            describedBy={errors.photoIds ? 'practical-photos-error' : undefined}
            invalid={Boolean(errors.photoIds)}
          />
          <FieldError id="practical-photos-error" message={errors.photoIds?.message} />
        </div>

        <FlagList flags={flags} live notChecked={notChecked} title="Numbers to double-check (as you type)" />

        <FormAlert message={serverError} />
        <SubmitButton pending={isSubmitting}>Send my {batchName(round)} to an instructor</SubmitButton>
      </form>
    </Card>
  );
}
