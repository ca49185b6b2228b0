'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { FormAlert } from '@/components/ui/form-alert';
import { useHydrated } from '@/components/ui/use-hydrated';
import { errorMessage, fetchJson } from '@/lib/fetcher';

/** Claim a waiting round to decide on it, or give the claim back (a coordinator may release anyone's). */
export function ClaimControls({ practicalId, action }: { practicalId: number; action: 'claim' | 'release' }) {
  const router = useRouter();
  const hydrated = useHydrated();
  const [pending, setPending] = useState(false);
  const [error, setError] = useState<string | null>(null);

  const send = async () => {
    setPending(true);
    setError(null);
    try {
      await fetchJson(`/api/practicals/${practicalId}/claim`, { method: action === 'claim' ? 'POST' : 'DELETE' });
      router.refresh();
    } catch (error) {
      setError(errorMessage(error, 'That did not work. Please reload the page and try again.'));
    } finally {
      setPending(false);
    }
  };

  return (
    <div className="space-y-2">
      <Button variant={action === 'claim' ? 'primary' : 'secondary'} size="sm" pending={pending} disabled={!hydrated} onClick={send}>
        {action === 'claim' ? 'Claim this submission' : 'Release the claim'}
      </Button>
      <FormAlert message={error} />
    </div>
  );
}
