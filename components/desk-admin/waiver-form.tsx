'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { Select } from '@/components/ui/select';
import { SubmitButton } from '@/components/ui/submit-button';
import { TextField } from '@/components/ui/text-field';
import { useToast } from '@/components/ui/toast';
import { WaiverSchema, type WaiverInput } from '@/lib/validations/waiver';
import { FetchError, postJson } from '@/lib/fetcher';

/** The coordinator's fee waiver form (react-hook-form, the schema POST /api/waivers uses). */
export function WaiverForm({ courses, defaultExpiry }: { courses: { id: number; title: string }[]; defaultExpiry: string }) {
  const router = useRouter();
  const toast = useToast();
  const [message, setMessage] = useState<string | null>(null);
  const defaults: WaiverInput = { code: '', courseId: '', maxUses: 1, expiresOn: defaultExpiry, note: '' };
  const { register, handleSubmit, setError, reset, formState } = useForm<WaiverInput, unknown, z.output<typeof WaiverSchema>>({
    resolver: zodResolver(WaiverSchema),
    defaultValues: defaults,
    mode: 'onTouched',
  });
  const err = (name: keyof WaiverInput) => formState.errors[name]?.message as string | undefined;

  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    try {
      const body = await postJson<{ waiver: { code: string } }>('/api/waivers', {
        ...values,
        code: values.code ?? '',
        courseId: values.courseId ?? '',
        note: values.note ?? '',
      });
      toast.show(`Waiver code ${body.waiver.code} created.`, 'success');
      reset(defaults);
      router.refresh();
    } catch (e) {
      if (!(e instanceof FetchError) || e.unreachable) return setMessage('Brinewright could not be reached; try again.');
      setMessage(e.message);
      for (const [field, messages] of Object.entries(e.fields)) setError(field as keyof WaiverInput, { message: messages[0] });
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4 sm:grid-cols-2" aria-label="New fee waiver code">
      <TextField
        label="Code"
        hint="Leave empty to generate one with 12 random characters. A word you choose is easy to guess: keep its uses few and its last day near."
        autoComplete="off"
        error={err('code')}
        {...register('code')}
      />
      <Select
        label="Course"
        options={[{ value: '', label: 'Any course' }, ...courses.map((c) => ({ value: String(c.id), label: c.title }))]}
        error={err('courseId')}
        {...register('courseId')}
      />
      <TextField label="Number of uses" type="number" min={1} max={1000} inputMode="numeric" error={err('maxUses')} {...register('maxUses')} />
      <TextField
        label="Last day it works"
        type="date"
        hint="The code stops working after this day (UTC)."
        error={err('expiresOn')}
        {...register('expiresOn')}
      />
      <TextField label="Note" hint="For whom, or why (optional)." className="sm:col-span-2" error={err('note')} {...register('note')} />
      <div className="flex items-center gap-3 sm:col-span-2">
        <SubmitButton pending={formState.isSubmitting}>Create code</SubmitButton>
        <p role="status" aria-live="polite" className="text-sm font-medium text-beet-600">
          {message}
        </p>
      </div>
    </form>
  );
}
