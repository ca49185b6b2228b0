import type { Metadata } from 'next';
import { redirect } from 'next/navigation';
import { SerialForm } from '@/components/certificates/serial-form';
import { normalizeSerial } from '@/lib/certificates/serial';

export const metadata: Metadata = { title: 'Verify a certificate' };

export default async function VerifyPage({ searchParams }: { searchParams: Promise<{ serial?: string | string[] }> }) {
  const { serial } = await searchParams;
  const typed = (Array.isArray(serial) ? serial[0] : serial)?.trim();
  if (typed) redirect(`/verify/${encodeURIComponent(normalizeSerial(typed) ?? typed.slice(0, 40))}`);
  return (
    <div className="mx-auto max-w-xl space-y-6">
      <h1 className="text-3xl font-bold">Verify a certificate</h1>
      <p className="text-ink-soft">
        Type the serial printed on a Brinewright certificate, or scan its QR code. You will see whether it is valid, expired or revoked, with the name, the
        course and the dates on it.
      </p>
      <SerialForm />
    </div>
  );
}
