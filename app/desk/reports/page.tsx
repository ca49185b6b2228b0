import type { Metadata } from 'next';
import { ReportBarChart } from '@/components/desk/report-charts';
import { Card } from '@/components/ui/card';
import { EmptyRow, Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';
import { requirePageRole } from '@/lib/auth/guard';
import { fetchDeskReports } from '@/lib/desk/reports';
import { STATUS_LABEL } from '@/components/desk/labels';

export const metadata: Metadata = { title: 'Reports for funders' };
export const dynamic = 'force-dynamic';

const money = (cents: number, currency: string) => new Intl.NumberFormat('en-US', { style: 'currency', currency: currency.toUpperCase() }).format(cents / 100);
const monthLabel = (ym: string) =>
  new Intl.DateTimeFormat('en-US', { month: 'short', year: 'numeric', timeZone: 'UTC' }).format(new Date(`${ym}-01T00:00:00Z`));

// Palette colours from tailwind.config.ts (brine-600, copper-500, beet-600, honey-500).
const C = { brine: '#276552', copper: '#b86a2e', beet: '#8a1f41', honey: '#b98a12' };

export default async function ReportsPage() {
  await requirePageRole('/desk/reports', 'coordinator');
  const r = await fetchDeskReports();
  const statusData = r.byStatus.map((s) => ({ status: STATUS_LABEL[s.status], count: s.count }));
  const monthData = r.certificatesByMonth.map((m) => ({ month: monthLabel(m.month), issued: m.issued, revoked: m.revoked }));
  const workshopData = r.workshops.map((w) => ({ workshop: w.label, rate: w.completionPct }));
  const feeData = r.fees.map((f) => ({ month: monthLabel(f.month), collected: f.collectedCents / 100, refunded: f.refundedCents / 100 }));
  return (
    <div className="space-y-8">
      <h1 className="text-3xl font-bold">Reports</h1>

      <Card title="Enrollments by status">
        <ReportBarChart data={statusData} x="status" series={[{ key: 'count', name: 'Enrollments', color: C.brine }]} />
        <Table caption="Enrollments by status">
          <THead>
            <TR>
              <TH>Status</TH>
              <TH className="text-right">Enrollments</TH>
            </TR>
          </THead>
          <TBody>
            {r.byStatus.map((s) => (
              <TR key={s.status}>
                <TD>{STATUS_LABEL[s.status]}</TD>
                <TD className="text-right tabular-nums">{s.count}</TD>
              </TR>
            ))}
          </TBody>
        </Table>
      </Card>

      <Card title="Completion rate per workshop">
        <p className="mb-2 text-sm text-ink-soft">Completed enrollments as a share of the workshop&apos;s enrollments that were not withdrawn.</p>
        {workshopData.length ? (
          <ReportBarChart data={workshopData} x="workshop" unit="%" series={[{ key: 'rate', name: 'Completion rate', color: C.copper }]} />
        ) : null}
        <Table caption="Completion rate per workshop">
          <THead>
            <TR>
              <TH>Workshop</TH>
              <TH className="text-right">Enrolled</TH>
              <TH className="text-right">Completed</TH>
              <TH className="text-right">Certified</TH>
              <TH className="text-right">Completion rate</TH>
            </TR>
          </THead>
          <TBody>
            {r.workshops.length === 0 ? <EmptyRow colSpan={5}>No workshops yet.</EmptyRow> : null}
            {r.workshops.map((w) => (
              <TR key={w.id}>
                <TD>{w.label}</TD>
                <TD className="text-right tabular-nums">{w.enrolled}</TD>
                <TD className="text-right tabular-nums">{w.completed}</TD>
                <TD className="text-right tabular-nums">{w.certified}</TD>
                <TD className="text-right tabular-nums">{w.completionPct.toFixed(1)} %</TD>
              </TR>
            ))}
          </TBody>
        </Table>
      </Card>

      <Card title="Certificates per month">
        <ReportBarChart
          data={monthData}
          x="month"
          series={[
            { key: 'issued', name: 'Issued', color: C.brine },
            { key: 'revoked', name: 'Revoked', color: C.beet },
          ]}
        />
        <Table caption="Certificates issued and revoked per month (last 12 months)">
          <THead>
            <TR>
              <TH>Month</TH>
              <TH className="text-right">Issued</TH>
              <TH className="text-right">Revoked</TH>
            </TR>
          </THead>
          <TBody>
            {r.certificatesByMonth.map((m) => (
              <TR key={m.month}>
                <TD>{monthLabel(m.month)}</TD>
                <TD className="text-right tabular-nums">{m.issued}</TD>
                <TD className="text-right tabular-nums">{m.revoked}</TD>
              </TR>
            ))}
          </TBody>
        </Table>
      </Card>

      <Card title="Fees collected and refunded">
        <p className="mb-2 text-sm text-ink-soft">Payments by the month they were paid; refunds are counted against the month of the payment they return.</p>
        <ReportBarChart
          data={feeData}
          x="month"
          series={[
            { key: 'collected', name: 'Collected', color: C.honey },
            { key: 'refunded', name: 'Refunded', color: C.beet },
          ]}
        />
        <Table caption="Fees collected and refunded per month (last 12 months)">
          <THead>
            <TR>
              <TH>Month</TH>
              <TH className="text-right">Collected</TH>
              <TH className="text-right">Refunded</TH>
            </TR>
          </THead>
          <TBody>
            {r.fees.map((f) => (
              <TR key={`${f.month}-${f.currency}`}>
                <TD>{monthLabel(f.month)}</TD>
                <TD className="text-right tabular-nums">{money(f.collectedCents, f.currency)}</TD>
                <TD className="text-right tabular-nums">{money(f.refundedCents, f.currency)}</TD>
              </TR>
            ))}
            {r.feeTotals.map((t) => (
              <TR key={t.currency} className="font-semibold">
                <TH scope="row">Total (net {money(t.netCents, t.currency)})</TH>
                <TD className="text-right tabular-nums">{money(t.collectedCents, t.currency)}</TD>
                <TD className="text-right tabular-nums">{money(t.refundedCents, t.currency)}</TD>
              </TR>
            ))}
          </TBody>
        </Table>
      </Card>
    </div>
  );
}
