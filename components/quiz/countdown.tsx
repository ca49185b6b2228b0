'use client';

import { useEffect, useState } from 'react';

/** Time left until the deadline, announced politely once a minute; calls onExpire once at zero. */
export function Countdown({ deadlineAt, onExpire }: { deadlineAt: string; onExpire: () => void }) {
  const end = new Date(deadlineAt).getTime();
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const timer = setInterval(() => setNow(Date.now()), 1000);
    return () => clearInterval(timer);
  }, []);
  const left = Math.max(0, end - now);
  useEffect(() => {
    if (left === 0) onExpire();
  }, [left === 0]); // eslint-disable-line react-hooks/exhaustive-deps
  const minutes = Math.floor(left / 60_000);
  const seconds = Math.floor((left % 60_000) / 1000);
  return (
    <p className={left < 60_000 ? 'font-semibold text-beet-700' : 'text-ink-soft'}>
      <span aria-hidden="true">
        Time left: {minutes}:{String(seconds).padStart(2, '0')}
      </span>
      <span className="sr-only" aria-live="polite">
        {`${minutes} minute${minutes === 1 ? '' : 's'} left`}
      </span>
    </p>
  );
}
