'use client';

import { useState } from 'react';
import { FetchError, postJson } from '@/lib/fetcher';

/** One learner's attendance checkbox; saves at once and says so in a live region. */
export function AttendanceToggle({
  enrollmentId,
  learnerName,
  attended: initial,
  disabled,
}: {
  enrollmentId: number;
  learnerName: string;
  attended: boolean;
  disabled?: boolean;
}) {
  const [attended, setAttended] = useState(initial);
  const [pending, setPending] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const id = `attended-${enrollmentId}`;

  async function toggle(next: boolean) {
    setPending(true);
    setMessage(null);
    try {
      await postJson(`/api/enrollments/${enrollmentId}/attendance`, { attended: next });
      setAttended(next);
      setMessage(next ? 'Marked present.' : 'Mark cleared.');
    } catch (e) {
      setMessage(e instanceof FetchError && !e.unreachable ? e.message : 'Not saved: Brinewright could not be reached.');
    } finally {
      setPending(false);
    }
  }

  return (
    <div className="flex flex-wrap items-center gap-2">
      <input
        id={id}
        type="checkbox"
        className="h-4 w-4 accent-brine-700"
        checked={attended}
        disabled={pending || disabled}
        onChange={(e) => toggle(e.target.checked)}
        aria-describedby={`${id}-msg`}
      />
      <label htmlFor={id}>
        Attended<span className="sr-only">: {learnerName}</span>
      </label>
      <span id={`${id}-msg`} role="status" aria-live="polite" className="text-sm text-ink-soft">
        {message}
      </span>
    </div>
  );
}
