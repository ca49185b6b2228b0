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
import { FetchError, errorMessage, postJson } from '@/lib/fetcher';
import { WORKSHOP_TIME_ZONES, WorkshopSchema, type WorkshopInput } from '@/lib/validations/workshop';

type Props = {
  workshopId: number | null;
  defaults: WorkshopInput;
  courses: { id: number; title: string }[];
  instructors: { id: number; name: string }[];
};

/** The coordinator's workshop form: react-hook-form with the same zod schema its route handler uses. */
export function WorkshopForm({ workshopId, defaults, courses, instructors }: Props) {
  const router = useRouter();
  const toast = useToast();
  const [message, setMessage] = useState<string | null>(null);
  const { register, handleSubmit, setError, reset, formState } = useForm<WorkshopInput, unknown, z.output<typeof WorkshopSchema>>({
    resolver: zodResolver(WorkshopSchema),
    defaultValues: defaults,
    mode: 'onTouched',
  });
  const err = (name: keyof WorkshopInput) => formState.errors[name]?.message as string | undefined;

  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    try {
      await postJson(workshopId ? `/api/desk/workshops/${workshopId}` : '/api/desk/workshops', { ...values, instructorId: values.instructorId ?? '' });
    } catch (error) {
      setMessage(errorMessage(error, 'The workshop could not be saved. Try again.'));
      if (error instanceof FetchError)
        for (const [field, messages] of Object.entries(error.fields)) if (field in defaults) setError(field as keyof WorkshopInput, { message: messages[0] });
      return;
    }
    toast.show(workshopId ? 'Workshop saved.' : 'Workshop added.', 'success');
    if (workshopId) router.push('/desk/workshops');
    else reset(defaults);
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4 sm:grid-cols-2" aria-label={workshopId ? 'Edit workshop' : 'New workshop'}>
      <Select
        label="Course"
        options={[{ value: '', label: 'Choose a course' }, ...courses.map((c) => ({ value: String(c.id), label: c.title }))]}
        error={err('courseId')}
        {...register('courseId')}
      />
      <Select
        label="Instructor"
        options={[{ value: '', label: 'To be announced' }, ...instructors.map((i) => ({ value: String(i.id), label: i.name }))]}
        error={err('instructorId')}
        {...register('instructorId')}
      />
      <TextField label="Date" type="date" error={err('date')} {...register('date')} />
      <Select
        label="Time zone"
        hint="Times are entered as the clocks at the place show them."
        options={WORKSHOP_TIME_ZONES}
        error={err('timeZone')}
        {...register('timeZone')}
      />
      <TextField label="Starts at" type="time" error={err('startTime')} {...register('startTime')} />
      <TextField label="Ends at" type="time" error={err('endTime')} {...register('endTime')} />
      <TextField label="Place" hint="Hall or kitchen, street and town." className="sm:col-span-2" error={err('place')} {...register('place')} />
      <TextField label="Seats" type="number" min={1} max={200} inputMode="numeric" error={err('seats')} {...register('seats')} />
      <div className="flex items-center gap-2 self-end pb-2">
        <input id="attendanceRequired" type="checkbox" className="h-4 w-4 accent-brine-700" {...register('attendanceRequired')} />
        <label htmlFor="attendanceRequired" className="text-sm font-semibold">
          Attendance is required for the certificate
        </label>
      </div>
      <div className="flex items-center gap-3 sm:col-span-2">
        <SubmitButton pending={formState.isSubmitting}>{workshopId ? 'Save changes' : 'Add workshop'}</SubmitButton>
        <p role="status" aria-live="polite" className="text-sm font-medium text-beet-600">
          {message}
        </p>
      </div>
    </form>
  );
}
