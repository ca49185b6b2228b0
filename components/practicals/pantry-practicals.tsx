import { PracticalStatus } from '@/components/practicals/practical-status';
import { requirementsForCourse } from '@/lib/certificates/requirements';
import { fetchLearnerEnrollments } from '@/lib/data/foundation';
import { fetchPracticalStatus } from '@/lib/practicals/data';
import { getProgramIdentity } from '@/lib/program/settings';

/** Where the learner's practical batch stands for each course whose certificate needs one. */
export async function PantryPracticals({ userId }: { userId: number }) {
  const enrollments = (await fetchLearnerEnrollments({ userId })).filter(
    (e) => (e.status === 'active' || e.status === 'completed') && requirementsForCourse(e.courseSlug).practicalRequired,
  );
  if (enrollments.length === 0) return null;
  const [statuses, program] = await Promise.all([
    Promise.all(enrollments.map((e) => fetchPracticalStatus({ userId, enrollmentId: e.id }))),
    getProgramIdentity(),
  ]);
  return (
    <section aria-labelledby="pantry-practicals" className="space-y-3">
      <h2 id="pantry-practicals" className="text-xl font-bold">
        Practical batches
      </h2>
      <ul className="grid gap-3 md:grid-cols-2">
        {enrollments.map((e, i) => (
          <li key={e.id}>
            <p className="mb-1 font-semibold">{e.courseTitle}</p>
            <PracticalStatus courseSlug={e.courseSlug} latest={statuses[i]} timeZone={program.timeZone} />
          </li>
        ))}
      </ul>
    </section>
  );
}
