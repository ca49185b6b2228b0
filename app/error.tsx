'use client';

import { useEffect } from 'react';
import { Button } from '@/components/ui/button';

export default function ErrorPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  useEffect(() => {
    console.error(error);
  }, [error]);
  return (
    <div className="mx-auto max-w-xl space-y-4 py-12 text-center" role="alert">
      <h1 className="text-3xl font-bold">Something went wrong</h1>
      <p className="text-ink-soft">We could not load this page. If the database is restarting, trying again in a few seconds usually works.</p>
      <Button onClick={reset}>Try again</Button>
    </div>
  );
}
