import type { Metadata } from 'next';
import { ImportForm } from '@/components/desk-import/import-form';
import { requirePageRole } from '@/lib/auth/guard';

export const metadata: Metadata = { title: 'Import certificate holders' };

export default async function ImportHoldersPage() {
  await requirePageRole('/desk/import', 'coordinator');
  return (
    <div className="space-y-6">
      <h1 className="text-3xl font-bold">Import certificate holders</h1>
      <p className="max-w-prose text-ink-soft">
        Bring in the people your program certified before it used Brinewright. Each holder gets an account unless one exists (without a password: they set one
        from a reset link), and each certificate verifies publicly by its new serial and by the serial of your earlier records.
      </p>
      <ImportForm />
    </div>
  );
}
