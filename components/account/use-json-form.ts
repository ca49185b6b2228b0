'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm, type FieldValues, type Path } from 'react-hook-form';
import type { z } from 'zod';
import { errorMessage, FetchError, fetchJson } from '@/lib/fetcher';

/**
 * A react-hook-form form fed the server's own schema, sent as JSON to one route handler: the
 * server's sentence on success (`done`) or failure (`failure`), its field errors on the fields.
 */
export function useJsonForm<T extends FieldValues>(
  schema: z.ZodType<T, T>,
  url: string,
  options: { method?: string; onDone?: (body: Record<string, unknown>, values: T) => Promise<void> | void; defaultValues?: Partial<T> } = {},
) {
  const [done, setDone] = useState<string | null>(null);
  const [failure, setFailure] = useState<FetchError | null>(null);
  const form = useForm<T>({ resolver: zodResolver(schema), mode: 'onTouched', defaultValues: options.defaultValues as never });
  const onSubmit = form.handleSubmit(async (values) => {
    setDone(null);
    setFailure(null);
    try {
      const body = await fetchJson<Record<string, unknown>>(url, { method: options.method ?? 'POST', body: JSON.stringify(values) });
      // The follow-up (a fresh sign-in, a refresh) finishes before the sentence says it is done.
      await options.onDone?.(body, values);
      setDone(typeof body.message === 'string' ? body.message : 'Done.');
    } catch (e) {
      const error = e instanceof FetchError ? e : new FetchError(0, {}, errorMessage(e, 'Something went wrong. Please try again.'));
      for (const [field, messages] of Object.entries(error.fields)) {
        if (field in values) form.setError(field as Path<T>, { message: messages[0] });
      }
      setFailure(error);
    }
  });
  return { ...form, onSubmit, done, failure, setDone };
}
