'use client';

import { usePathname } from 'next/navigation';
import { ButtonLink } from '@/components/ui/button';

/** Shown (with status 403) to a signed-in learner who opens a members-only lesson without an enrollment. */
export function EnrollOffer() {
  const pathname = usePathname() ?? '';
  const course = /^\/learn\/([a-z0-9-]+)\//.exec(pathname)?.[1];
  return (
    <div className="mx-auto max-w-xl space-y-4 py-12 text-center">
      <p className="font-display text-5xl text-copper-500" aria-hidden="true">
        403
      </p>
      <h1 className="text-3xl font-bold">This lesson is for enrolled learners</h1>
      <p className="text-ink-soft">
        The first lessons of a course are open to everyone; the rest open once you enroll. Choose a workshop date and pay the course fee, or use a fee waiver
        code from your program coordinator, and this lesson is yours to read.
      </p>
      <div className="flex flex-wrap justify-center gap-3">
        {course ? <ButtonLink href={`/courses/${course}#workshops`}>Enroll in the course</ButtonLink> : null}
        <ButtonLink href="/courses" variant="secondary">
          See the courses
        </ButtonLink>
      </div>
    </div>
  );
}
