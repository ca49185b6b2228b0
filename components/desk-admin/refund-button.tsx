'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { TextField } from '@/components/ui/text-field';
import { useToast } from '@/components/ui/toast';
import { FetchError, postJson } from '@/lib/fetcher';

/** Refund with a confirmation step; the server refunds through the payment service and e-mails the learner. */
export function RefundButton({ enrollmentId, learnerName, amount }: { enrollmentId: number; learnerName: string; amount: string }) {
  const router = useRouter();
  const toast = useToast();
  const [open, setOpen] = useState(false);
  const [pending, setPending] = useState(false);
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);

  async function refund() {
    setPending(true);
    setError(null);
    try {
      await postJson(`/api/enrollments/${enrollmentId}/refund`, { reason });
      setOpen(false);
      toast.show(`Refunded ${amount} to ${learnerName}.`, 'success');
      router.refresh();
    } catch (e) {
      setError(e instanceof FetchError && !e.unreachable ? e.message : 'Brinewright could not be reached; nothing was refunded.');
    } finally {
      setPending(false);
    }
  }

  return (
    <>
      <Button size="sm" variant="danger" onClick={() => setOpen(true)}>
        Refund<span className="sr-only"> {learnerName}</span>
      </Button>
      <Dialog
        open={open}
        onClose={() => setOpen(false)}
        title={`Refund ${amount} to ${learnerName}?`}
        footer={
          <>
            <Button variant="secondary" onClick={() => setOpen(false)}>
              Keep the payment
            </Button>
            <Button variant="danger" pending={pending} onClick={refund}>
              Refund {amount}
            </Button>
          </>
        }
      >
        <p className="mb-3 text-sm">
          The fee goes back to the learner’s card, the enrollment is withdrawn and the workshop seat is released. The learner gets an e-mail.
        </p>
        <TextField
          label="Reason (kept in the audit log)"
          value={reason}
          onChange={(e) => setReason(e.target.value)}
          maxLength={300}
          error={error ?? undefined}
        />
      </Dialog>
    </>
  );
}
