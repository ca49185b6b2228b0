import type { Metadata } from 'next';
import { WaiverForm } from '@/components/desk-admin/waiver-form';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { EmptyRow, Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';
import { requirePageRole } from '@/lib/auth/guard';
import { fetchCourseOptions, fetchWaivers } from '@/lib/enrollment/queries';

export const metadata: Metadata = { title: 'Fee waivers' };
export const dynamic = 'force-dynamic';

const day = (iso: string) => new Intl.DateTimeFormat('en-US', { year: 'numeric', month: 'long', day: 'numeric', timeZone: 'UTC' }).format(new Date(iso));

export default async function DeskWaiversPage() {
  await requirePageRole('/desk/waivers', 'coordinator');
  const [waivers, courses] = await Promise.all([fetchWaivers(), fetchCourseOptions()]);
  const inAMonth = new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10);
  return (
    <div className="space-y-8">
      <h1 className="text-3xl font-bold">Fee waivers</h1>
      <p className="max-w-prose text-ink-soft">
        A waiver code lets a learner enroll without paying the course fee, for volunteers, scholarships or partner agencies. Each use is counted; the code stops
        working when its uses run out or after its last day.
      </p>
      <Table caption={`${waivers.length} code${waivers.length === 1 ? '' : 's'}`}>
        <THead>
          <TR>
            <TH>Code</TH>
            <TH>Course</TH>
            <TH>Used</TH>
            <TH>Last day</TH>
            <TH>Note</TH>
          </TR>
        </THead>
        <TBody>
          {waivers.length === 0 ? <EmptyRow colSpan={5}>No waiver codes yet.</EmptyRow> : null}
          {waivers.map((w) => (
            <TR key={w.id}>
              <TD className="font-mono font-semibold">{w.code}</TD>
              <TD>{w.courseTitle ?? 'Any course'}</TD>
              <TD>
                {w.uses} of {w.maxUses}
                {w.uses >= w.maxUses ? (
                  <Badge tone="neutral" className="ml-2">
                    Used up
                  </Badge>
                ) : null}
              </TD>
              <TD>
                {day(w.expiresAt)}
                {w.expired ? (
                  <Badge tone="beet" className="ml-2">
                    Expired
                  </Badge>
                ) : null}
              </TD>
              <TD>{w.note ?? ''}</TD>
            </TR>
          ))}
        </TBody>
      </Table>
      <Card title="Create a waiver code">
        <WaiverForm courses={courses} defaultExpiry={inAMonth} />
      </Card>
    </div>
  );
}
