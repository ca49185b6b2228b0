import type { Metadata } from 'next';
import Link from 'next/link';
import { WorkshopForm } from '@/components/desk-admin/workshop-form';
import { Badge } from '@/components/ui/badge';
import { Card } from '@/components/ui/card';
import { EmptyRow, Table, TBody, TD, TH, THead, TR } from '@/components/ui/table';
import { requirePageRole } from '@/lib/auth/guard';
import { formatWorkshopDate, formatWorkshopTimes } from '@/lib/enrollment/format';
import { fetchCourseOptions, fetchInstructorOptions, fetchWorkshopsForDesk } from '@/lib/enrollment/queries';

export const metadata: Metadata = { title: 'Workshops' };
export const dynamic = 'force-dynamic';

export default async function DeskWorkshopsPage() {
  await requirePageRole('/desk/workshops', 'coordinator');
  const [workshops, courses, instructors] = await Promise.all([fetchWorkshopsForDesk(), fetchCourseOptions(), fetchInstructorOptions()]);
  const now = Date.now();
  return (
    <div className="space-y-8">
      <h1 className="text-3xl font-bold">Workshops</h1>
      <Table caption={`${workshops.length} workshop${workshops.length === 1 ? '' : 's'}, newest date first`}>
        <THead>
          <TR>
            <TH>Date and time</TH>
            <TH>Course</TH>
            <TH>Place</TH>
            <TH>Instructor</TH>
            <TH>Seats taken</TH>
            <TH>Attendance</TH>
            <TH>
              <span className="sr-only">Actions</span>
            </TH>
          </TR>
        </THead>
        <TBody>
          {workshops.length === 0 ? <EmptyRow colSpan={7}>No workshops yet. Add the first one below.</EmptyRow> : null}
          {workshops.map((w) => (
            <TR key={w.id}>
              <TD>
                <div className="font-semibold">{formatWorkshopDate(w.startsAt, w.timeZone)}</div>
                <div className="text-ink-soft">{formatWorkshopTimes(w.startsAt, w.endsAt, w.timeZone)}</div>
                {new Date(w.startsAt).getTime() < now ? <Badge>Past</Badge> : null}
              </TD>
              <TD>{w.courseTitle}</TD>
              <TD>{w.place}</TD>
              <TD>{w.instructorName ?? 'To be announced'}</TD>
              <TD>
                {w.taken} of {w.seats}
                {w.taken >= w.seats ? (
                  <Badge tone="beet" className="ml-2">
                    Full
                  </Badge>
                ) : null}
              </TD>
              <TD>{w.attendanceRequired ? 'Required' : 'Optional'}</TD>
              <TD>
                <Link href={`/desk/workshops/${w.id}`} className="font-semibold text-brine-800 underline">
                  Edit<span className="sr-only"> the workshop of {formatWorkshopDate(w.startsAt, w.timeZone)}</span>
                </Link>
              </TD>
            </TR>
          ))}
        </TBody>
      </Table>
      <Card title="Add a workshop">
        <WorkshopForm
          workshopId={null}
          courses={courses}
          instructors={instructors}
          defaults={{
            courseId: String(courses[0]?.id ?? ''),
            date: '',
            startTime: '09:00',
            endTime: '14:00',
            timeZone: 'America/Denver',
            place: '',
            seats: 12,
            instructorId: '',
            attendanceRequired: true,
          }}
        />
      </Card>
    </div>
  );
}
