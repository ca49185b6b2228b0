'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { errorMessage, postJson } from '@/lib/fetcher';

/** The Pantry's button for a completed refresher: issues its certificate, then refreshes the page. */
export function ClaimRefresher({ enrollmentId }: { enrollmentId: number }) {
  const router = useRouter();
  const [state, setState] = useState<{ pending: boolean; error: string | null }>({ pending: false, error: null });
  async function claim() {
    setState({ pending: true, error: null });
    try {
      await postJson('/api/certificates/refresher', { enrollmentId });
    } catch (e) {
      setState({ pending: false, error: errorMessage(e, 'Could not issue the certificate. Please try again.') });
      return;
    }
    setState({ pending: false, error: null });
    router.refresh();
  }
  return (
    <div className="rounded-jar border-l-4 border-brine-500 bg-brine-50 p-4">
      <p className="font-semibold">You have completed the volunteer refresher.</p>
      <p className="mt-1 text-sm">Issue your new certificate now; its validity runs on from your current one.</p>
      <Button className="mt-3" size="sm" onClick={claim} pending={state.pending}>
        Issue my refresher certificate
      </Button>
      <p role="alert" className="mt-2 text-sm text-beet-700">
        {state.error}
      </p>
    </div>
  );
}
