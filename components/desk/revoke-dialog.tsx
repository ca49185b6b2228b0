'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { SubmitButton } from '@/components/ui/submit-button';
import { TextArea } from '@/components/ui/text-field';
import { useToast } from '@/components/ui/toast';
import { RevokeSchema, type RevokeInput } from '@/lib/validations/certificate';
import { errorMessage, postJson } from '@/lib/fetcher';

type Target = { certificateId: number; serial: string; learnerName: string };

/** Asks for the reason and revokes; the same schema checks the reason here and on the server. */
export function RevokeDialog({ target, onClose, onDone }: { target: Target | null; onClose: () => void; onDone: () => void }) {
  const toast = useToast();
  const form = useForm<RevokeInput>({ resolver: zodResolver(RevokeSchema), defaultValues: { reason: '' } });
  const error = form.formState.errors.reason?.message;
  const submit = form.handleSubmit(async (values) => {
    if (!target) return;
    try {
      await postJson(`/api/desk/certificates/${target.certificateId}/revoke`, values);
      toast.show(`Certificate ${target.serial} revoked.`, 'success');
      form.reset();
      onDone();
      onClose();
    } catch (e) {
      const message = errorMessage(e, 'Could not revoke the certificate.');
      form.setError('reason', { message });
    }
  });
  return (
    <Dialog open={target !== null} onClose={onClose} title="Revoke certificate">
      {target ? (
        <form onSubmit={submit} className="space-y-3" noValidate>
          <p className="text-sm">
            Revoke <strong>{target.serial}</strong> of {target.learnerName}? Its verification page will show it as revoked. The learner is told by e-mail.
          </p>
          <TextArea label="Reason" id="revoke-reason" rows={3} error={error} {...form.register('reason')} />
          <div className="flex justify-end gap-2">
            <Button variant="secondary" onClick={onClose}>
              Cancel
            </Button>
            <SubmitButton variant="danger" pending={form.formState.isSubmitting}>
              Revoke
            </SubmitButton>
          </div>
        </form>
      ) : null}
    </Dialog>
  );
}
