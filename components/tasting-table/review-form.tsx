'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import type { input } from 'zod';
import { FormAlert } from '@/components/ui/form-alert';
import { SubmitButton } from '@/components/ui/submit-button';
import { FieldError, TextArea, TextField } from '@/components/ui/text-field';
import { useToast } from '@/components/ui/toast';
import { RUBRIC_CRITERIA, reviewSchema, type ReviewInput } from '@/lib/validations/practical';
import { errorMessage, FetchError, postJson } from '@/lib/fetcher';
import { DECISION_ACTION, batchName } from '@/lib/practicals/words';

type FormInput = input<typeof reviewSchema>;

/** The rubric, criterion by criterion, and the decision on one batch. */
export function ReviewForm({ practicalId, round }: { practicalId: number; round: number }) {
  const router = useRouter();
  const toast = useToast();
  const [serverError, setServerError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    control,
    formState: { errors, isSubmitting },
  } = useForm<FormInput, unknown, ReviewInput>({
    resolver: zodResolver(reviewSchema),
    defaultValues: { comment: '', rubric: Object.fromEntries(RUBRIC_CRITERIA.map((c) => [c.id, { comment: '' }])) as FormInput['rubric'] },
  });
  const decision = useWatch({ control, name: 'decision' });

  const onSubmit = async (input: ReviewInput) => {
    setServerError(null);
    try {
      await postJson(`/api/practicals/${practicalId}/review`, input);
    } catch (e) {
      for (const [key, messages] of Object.entries(e instanceof FetchError ? e.fields : {})) setError(key as 'comment', { message: messages[0] });
      setServerError(errorMessage(e, 'The review could not be saved. Please try again.'));
      return;
    }
    toast.show(
      input.decision === 'approved' ? 'The batch passed the table. The learner gets an e-mail.' : 'Another batch asked for. The learner gets an e-mail.',
      'success',
    );
    router.refresh();
  };

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="space-y-5" aria-label={`Review of the ${batchName(round)}`}>
      <div className="space-y-4">
        {RUBRIC_CRITERIA.map((c) => {
          const err = errors.rubric?.[c.id];
          const verdictError = err?.verdict?.message;
          const commentError = err?.comment?.message;
          return (
            <fieldset key={c.id} className="rounded-lg border border-brine-100 p-3" aria-describedby={verdictError ? `${c.id}-verdict-error` : undefined}>
              <legend className="px-1 font-semibold">{c.label}</legend>
              <div className="flex flex-wrap gap-4">
                <label className="flex items-center gap-2 text-sm">
                  <input type="radio" value="met" {...register(`rubric.${c.id}.verdict`)} /> Met
                </label>
                <label className="flex items-center gap-2 text-sm">
                  <input type="radio" value="not_met" {...register(`rubric.${c.id}.verdict`)} /> Not met
                </label>
              </div>
              <FieldError id={`${c.id}-verdict-error`} message={verdictError} />
              <TextField
                label={`Comment on ${c.label.toLowerCase()}`}
                id={`${c.id}-comment`}
                className="mt-2"
                error={commentError}
                {...register(`rubric.${c.id}.comment`)}
              />
            </fieldset>
          );
        })}
      </div>

      <fieldset className="space-y-2" aria-describedby={errors.decision ? 'decision-error' : undefined}>
        <legend className="font-display text-lg font-bold">Decision</legend>
        <label className="flex items-center gap-2">
          <input type="radio" value="approved" {...register('decision')} /> {DECISION_ACTION.approved}
        </label>
        <label className="flex items-center gap-2">
          <input type="radio" value="changes_requested" {...register('decision')} /> {DECISION_ACTION.changes_requested}
        </label>
        <FieldError id="decision-error" message={errors.decision?.message} />
      </fieldset>

      <TextArea
        label={decision === 'changes_requested' ? 'What to do differently next batch (required)' : 'Comment for the learner'}
        id="review-comment"
        error={errors.comment?.message}
        {...register('comment')}
      />

      <FormAlert message={serverError} />
      <SubmitButton pending={isSubmitting}>Save the review</SubmitButton>
    </form>
  );
}
