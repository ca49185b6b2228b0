import type { Metadata } from 'next';
import { CertificateDesk } from '@/components/desk/certificate-desk';
import { requirePageRole } from '@/lib/auth/guard';

export const metadata: Metadata = { title: 'Certificate desk' };

export default async function DeskPage() {
  await requirePageRole('/desk', 'coordinator');
  return (
    <div className="space-y-6">
      <div>
        <h1 className="text-3xl font-bold">Certificate desk</h1>
        <p className="mt-1 max-w-3xl text-ink-soft">
          Every enrollment with what it still needs. Select eligible learners to issue their certificates, or export the roster. A certificate records completed
          training; it never certifies a recipe as safe.
        </p>
      </div>
      <CertificateDesk />
    </div>
  );
}
