import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { WorkshopForm } from '@/components/desk-admin/workshop-form';
import { Card } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/guard';
import { fetchCourseOptions, fetchInstructorOptions, fetchWorkshopsForDesk } from '@/lib/enrollment/queries';
import { toZonedInput } from '@/lib/enrollment/time';

export const metadata: Metadata = { title: 'Edit a workshop' };
export const dynamic = 'force-dynamic';

export default async function EditWorkshopPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  await requirePageRole(`/desk/workshops/${id}`, 'coordinator');
  const [workshops, courses, instructors] = await Promise.all([fetchWorkshopsForDesk(), fetchCourseOptions(), fetchInstructorOptions()]);
  const w = workshops.find((x) => String(x.id) === id);
  if (!w) notFound();
  const start = toZonedInput(new Date(w.startsAt), w.timeZone);
  const end = toZonedInput(new Date(w.endsAt), w.timeZone);
  return (
    <div className="space-y-6">
      <p>
        <Link href="/desk/workshops" className="text-brine-800 underline">
          ← All workshops
        </Link>
      </p>
      <h1 className="text-3xl font-bold">Edit workshop</h1>
      <p className="text-ink-soft">
        {w.taken} of {w.seats} seats are taken; seats cannot go below that.
      </p>
      <Card>
        <WorkshopForm
          workshopId={w.id}
          courses={courses}
          instructors={instructors}
          defaults={{
            courseId: String(w.courseId),
            date: start.date,
            startTime: start.time,
            endTime: end.time,
            timeZone: w.timeZone,
            place: w.place,
            seats: w.seats,
            instructorId: w.instructorId ? String(w.instructorId) : '',
            attendanceRequired: w.attendanceRequired,
          }}
        />
      </Card>
    </div>
  );
}
