import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { PracticalForm } from '@/components/practicals/practical-form';
import { PracticalHistory } from '@/components/practicals/practical-history';
import { PracticalStatus } from '@/components/practicals/practical-status';
import { ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { findActiveEnrollment } from '@/lib/access';
import { requirePageRole } from '@/lib/auth/guard';
import { fetchCourseHeading, fetchLearnerPracticals, summarize } from '@/lib/practicals/data';
import { getProgramIdentity } from '@/lib/program/settings';
import { batchName } from '@/lib/practicals/words';

export const metadata: Metadata = { title: 'Practical batch' };

export default async function PracticalPage({ params }: { params: Promise<{ course: string }> }) {
  const { course: slug } = await params;
  const user = await requirePageRole(`/learn/${slug}/practical`, 'learner');
  const course = await fetchCourseHeading({ slug });
  if (!course) notFound();
  const enrollment = await findActiveEnrollment(user.id, slug);

  if (!enrollment) {
    return (
      <div className="mx-auto max-w-3xl space-y-6">
        <h1 className="text-3xl font-bold">Practical batch</h1>
        <Card>
          <p className="mb-4 text-ink-soft">
            The practical is for learners with an active enrollment in {course.title}. Enroll in the course first, then come back here.
          </p>
          <ButtonLink href={`/courses/${slug}`}>See the course</ButtonLink>
        </Card>
      </div>
    );
  }

  const [rounds, program] = await Promise.all([fetchLearnerPracticals({ userId: user.id, enrollmentId: enrollment.id }), getProgramIdentity()]);
  const latest = summarize(rounds);
  const canSubmit = !latest || latest.status === 'changes_requested';

  return (
    <div className="mx-auto max-w-4xl space-y-6">
      <header className="space-y-2">
        <p className="text-sm font-semibold text-copper-700">{course.title}</p>
        <h1 className="text-3xl font-bold">Practical batch</h1>
        <p className="text-ink-soft">
          Put up a batch at home from a tested recipe, then send its details and photos to the Tasting table. Brinewright checks your numbers against the
          published tables as you type; an instructor looks at the jars themselves.
        </p>
      </header>
      <aside className="rounded-jar border-l-4 border-copper-500 bg-copper-50 p-4 text-sm" aria-label="Caution">
        <p className="font-semibold">Caution</p>
        <p>
          Follow a tested recipe from a recognised food-safety authority exactly, and your local extension office&apos;s guidance for your altitude. A batch
          with nothing to double-check is not thereby safe: discard any jar that leaks, bulges, spurts or smells off, without tasting it.
        </p>
      </aside>
      <PracticalStatus courseSlug={slug} latest={latest} timeZone={program.timeZone} />
      <PracticalForm
        courseSlug={slug}
        round={(latest?.round ?? 0) + 1}
        open={canSubmit}
        title={latest ? `Send your ${batchName(latest.round + 1)}` : 'Send your batch'}
      />
      <PracticalHistory rounds={rounds} timeZone={program.timeZone} />
    </div>
  );
}
