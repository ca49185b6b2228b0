import type { Metadata } from 'next';
import { AttendanceToggle } from '@/components/enrollment/attendance-toggle';
import { Card } from '@/components/ui/card';
import { EmptyRow, Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';
import { requirePageRole } from '@/lib/auth/guard';
import { formatWorkshopDate, formatWorkshopTimes } from '@/lib/enrollment/format';
import { fetchRoster, fetchWorkshopsForDesk } from '@/lib/enrollment/queries';
import { roleAllows } from '@/lib/roles';

export const metadata: Metadata = { title: 'My workshops' };
export const dynamic = 'force-dynamic';

// Attendance opens on the day of the workshop (12 hours before it starts), as the server checks.
const OPENS_BEFORE_MS = 12 * 3600_000;

export default async function InstructorWorkshopsPage() {
  const user = await requirePageRole('/tasting-table/workshops', 'instructor');
  const everyone = roleAllows(user.roles, ['coordinator']);
  const workshops = await fetchWorkshopsForDesk(everyone ? {} : { instructorId: user.id });
  const rosters = await Promise.all(workshops.map((w) => fetchRoster({ workshopId: w.id })));
  const now = Date.now();
  return (
    <div className="space-y-6">
      <h1 className="text-3xl font-bold">{everyone ? 'Workshops' : 'My workshops'}</h1>
      <p className="max-w-prose text-ink-soft">Mark each learner who attended. Where attendance is required, the certificate waits for this mark.</p>
      {workshops.length === 0 ? (
        <p className="rounded-jar border border-brine-100 bg-white p-4">
          No workshops are assigned to you yet. The coordinator assigns instructors at the Certificate desk.
        </p>
      ) : null}
      {workshops.map((w, i) => {
        const open = new Date(w.startsAt).getTime() - OPENS_BEFORE_MS <= now;
        return (
          <Card key={w.id} title={`${formatWorkshopDate(w.startsAt, w.timeZone)} · ${w.courseTitle}`}>
            <p className="mb-3 text-sm text-ink-soft">
              {formatWorkshopTimes(w.startsAt, w.endsAt, w.timeZone)} · {w.place} · {w.taken} of {w.seats} seats taken · attendance{' '}
              {w.attendanceRequired ? 'required' : 'optional'}
              {open ? '' : ' · attendance can be marked from the day of the workshop'}
            </p>
            <Table caption={`Learners (${rosters[i].length})`}>
              <THead>
                <TR>
                  <TH>Learner</TH>
                  <TH>E-mail</TH>
                  <TH>Attendance</TH>
                </TR>
              </THead>
              <TBody>
                {rosters[i].length === 0 ? <EmptyRow colSpan={3}>No learners enrolled yet.</EmptyRow> : null}
                {rosters[i].map((r) => (
                  <TR key={r.enrollmentId}>
                    <TD>{r.learnerName}</TD>
                    <TD>{r.learnerEmail}</TD>
                    <TD>
                      <AttendanceToggle enrollmentId={r.enrollmentId} learnerName={r.learnerName} attended={Boolean(r.attendedAt)} disabled={!open} />
                    </TD>
                  </TR>
                ))}
              </TBody>
            </Table>
          </Card>
        );
      })}
    </div>
  );
}
