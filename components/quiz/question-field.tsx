'use client';

import type { UseFormRegister } from 'react-hook-form';
import { fieldClasses } from '@/components/ui/text-field';
import { cn } from '@/lib/cn';
import { unitLabel, type FormValues, type PublicQuestion } from './types';

const optionClasses =
  'flex cursor-pointer items-start gap-3 rounded-lg border border-brine-100 bg-white px-3 py-2 hover:bg-brine-50 has-[:checked]:border-brine-500 has-[:checked]:bg-brine-50';

/** One question of the form, as a fieldset whose legend is the prompt. */
export function QuestionField({
  question,
  index,
  register,
  error,
}: {
  question: PublicQuestion;
  index: number;
  register: UseFormRegister<FormValues>;
  error?: string;
}) {
  const base = `q.${question.id}` as const;
  const errorId = error ? `${question.id}-error` : undefined;
  const hintId = `${question.id}-hint`;
  const units = question.kind === 'numeric' ? question.units : [];
  return (
    <fieldset
      className="rounded-jar border border-brine-100 bg-paper p-4"
      aria-describedby={[hintId, errorId].filter(Boolean).join(' ')}
      data-question={question.id}
    >
      <legend className="px-1 font-semibold">
        <span className="mr-2 text-ink-soft">{index + 1}.</span>
        {question.prompt}
      </legend>
      <p id={hintId} className="mb-2 text-sm text-ink-soft">
        {question.kind === 'multiple' ? 'Select all that apply.' : question.kind === 'numeric' ? 'Enter a number and choose its unit.' : 'Choose one.'}
      </p>
      {question.kind === 'single' || question.kind === 'multiple' ? (
        <div className="space-y-2">
          {question.choices.map((c) => (
            <label key={c.id} className={optionClasses}>
              <input
                type={question.kind === 'single' ? 'radio' : 'checkbox'}
                value={c.id}
                className="mt-1 accent-brine-600"
                {...register(question.kind === 'single' ? (`${base}.choice` as const) : (`${base}.choices` as const))}
              />
              <span>{c.text}</span>
            </label>
          ))}
        </div>
      ) : question.kind === 'true-false' ? (
        <div className="flex gap-3">
          {(['true', 'false'] as const).map((v) => (
            <label key={v} className={cn(optionClasses, 'min-w-28')}>
              <input type="radio" value={v} className="mt-1 accent-brine-600" {...register(`${base}.tf` as const)} />
              <span>{v === 'true' ? 'True' : 'False'}</span>
            </label>
          ))}
        </div>
      ) : (
        <div className="flex flex-wrap items-end gap-3">
          <div>
            <label htmlFor={`${question.id}-value`} className="block text-sm font-semibold">
              Your answer
            </label>
            <input
              id={`${question.id}-value`}
              inputMode="decimal"
              autoComplete="off"
              aria-invalid={error ? true : undefined}
              aria-describedby={errorId}
              className={cn(fieldClasses, 'w-40', error ? 'border-beet-500' : 'border-ink-faint/40')}
              {...register(`${base}.value` as const)}
            />
          </div>
          {units.length > 1 ? (
            <div>
              <label htmlFor={`${question.id}-unit`} className="block text-sm font-semibold">
                Unit
              </label>
              <select id={`${question.id}-unit`} className={cn(fieldClasses, 'w-32 border-ink-faint/40')} {...register(`${base}.unit` as const)}>
                {units.map((u) => (
                  <option key={u} value={u}>
                    {unitLabel(u)}
                  </option>
                ))}
              </select>
            </div>
          ) : (
            <span className="pb-2 text-ink-soft">{unitLabel(units[0])}</span>
          )}
        </div>
      )}
      {error ? (
        <p id={errorId} className="mt-2 text-sm font-medium text-beet-600" role="alert">
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}
