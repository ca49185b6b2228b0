import { ButtonLink } from '@/components/ui/button';

export default function CourseNotFound() {
  return (
    <div className="mx-auto max-w-xl space-y-4 py-12 text-center">
      <h1 className="text-3xl font-bold">No such course</h1>
      <p className="text-ink-soft">That course is not in the catalog. It may have been renamed or retired.</p>
      <ButtonLink href="/courses">See all courses</ButtonLink>
    </div>
  );
}
