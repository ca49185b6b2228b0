import type { Metadata } from 'next';
import { STATUS_LABEL } from '@/components/desk/labels';
import { RefundButton } from '@/components/desk-admin/refund-button';
import { Badge, type Tone } from '@/components/ui/badge';
import { EmptyRow, Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';
import { requirePageRole } from '@/lib/auth/guard';
import { formatMoney, formatWorkshopDate } from '@/lib/enrollment/format';
import { fetchPaymentsForDesk } from '@/lib/enrollment/queries';

export const metadata: Metadata = { title: 'Payments and refunds' };
export const dynamic = 'force-dynamic';

const TONE: Record<string, Tone> = { paid: 'brine', pending: 'honey', expired: 'neutral', refunded: 'copper' };
// In the words a coordinator uses: whether the fee came in, and what happened to the seat.
const LABEL: Record<string, string> = {
  paid: 'Paid',
  pending: 'Not paid yet, seat held',
  expired: 'Never paid, seat let go',
  refunded: 'Paid, then refunded',
};

export default async function DeskPaymentsPage() {
  await requirePageRole('/desk/payments', 'coordinator');
  const payments = await fetchPaymentsForDesk();
  return (
    <div className="space-y-6">
      <h1 className="text-3xl font-bold">Payments and refunds</h1>
      <p className="max-w-prose text-ink-soft">
        Card payments of course fees, newest first. A refund returns the fee through the payment service, withdraws the enrollment and frees the workshop seat.
      </p>
      <Table caption={`${payments.length} payment${payments.length === 1 ? '' : 's'}`}>
        <THead>
          <TR>
            <TH>Learner</TH>
            <TH>Course and workshop</TH>
            <TH>Amount</TH>
            <TH>Payment</TH>
            <TH>Enrollment</TH>
            <TH>
              <span className="sr-only">Actions</span>
            </TH>
          </TR>
        </THead>
        <TBody>
          {payments.length === 0 ? <EmptyRow colSpan={6}>No card payments yet.</EmptyRow> : null}
          {payments.map((p) => (
            <TR key={p.paymentId}>
              <TD>
                <div className="font-semibold">{p.learnerName}</div>
                <div className="text-ink-soft">{p.learnerEmail}</div>
              </TD>
              <TD>
                <div>{p.courseTitle}</div>
                {p.workshopStartsAt && p.workshopTimeZone ? (
                  <div className="text-ink-soft">{formatWorkshopDate(p.workshopStartsAt, p.workshopTimeZone)}</div>
                ) : null}
              </TD>
              <TD>
                {formatMoney(p.amountCents, p.currency)}
                {p.refundedCents ? <div className="text-ink-soft">refunded {formatMoney(p.refundedCents, p.currency)}</div> : null}
              </TD>
              <TD>
                <Badge tone={TONE[p.status] ?? 'neutral'}>{LABEL[p.status] ?? p.status}</Badge>
              </TD>
              <TD>{STATUS_LABEL[p.enrollmentStatus as keyof typeof STATUS_LABEL] ?? p.enrollmentStatus}</TD>
              <TD>
                {p.status === 'paid' && p.enrollmentStatus !== 'completed' ? (
                  <RefundButton enrollmentId={p.enrollmentId} learnerName={p.learnerName} amount={formatMoney(p.amountCents, p.currency)} />
                ) : null}
              </TD>
            </TR>
          ))}
        </TBody>
      </Table>
    </div>
  );
}
