import type { Metadata } from 'next';
import { Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';
import { requirePageRole } from '@/lib/auth/guard';
import { fetchEnrollmentCounts } from '@/lib/data/foundation';

export const metadata: Metadata = { title: 'Certificate desk' };

const LABELS = { awaiting_payment: 'Awaiting payment', active: 'Active', completed: 'Completed', withdrawn: 'Withdrawn' } as const;

export default async function DeskPage() {
  await requirePageRole('/desk', 'coordinator');
  const counts = await fetchEnrollmentCounts();
  return (
    <div className="space-y-6">
      <h1 className="text-3xl font-bold">Certificate desk</h1>
      <Table caption="Enrollments by status">
        <THead>
          <TR>
            <TH>Status</TH>
            <TH className="text-right">Enrollments</TH>
          </TR>
        </THead>
        <TBody>
          {(Object.keys(LABELS) as (keyof typeof LABELS)[]).map((status) => (
            <TR key={status}>
              <TD>{LABELS[status]}</TD>
              <TD className="text-right tabular-nums">{counts[status]}</TD>
            </TR>
          ))}
        </TBody>
      </Table>
    </div>
  );
}
