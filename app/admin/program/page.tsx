import type { Metadata } from 'next';
import { ProgramForm } from '@/components/program/program-form';
import { requirePageRole } from '@/lib/auth/guard';
import { getProgramIdentity } from '@/lib/program/settings';

export const metadata: Metadata = { title: 'Program settings' };

export default async function ProgramSettingsPage() {
  await requirePageRole('/admin/program', 'admin');
  const program = await getProgramIdentity();
  const timeZones = Intl.supportedValuesOf('timeZone');
  return (
    <div className="space-y-6">
      <h1 className="text-3xl font-bold">Program settings</h1>
      <p className="max-w-prose text-ink-soft">
        Your program&apos;s name, contact and logo, shown in the header, in e-mails, on certificates issued from now on and on the verification page.
        Certificates already issued keep the wording they were issued with.
      </p>
      <ProgramForm program={program} timeZones={timeZones.includes(program.timeZone) ? timeZones : [program.timeZone, ...timeZones]} />
    </div>
  );
}
