import { ButtonLink } from '@/components/ui/button';

export default function LessonNotFound() {
  return (
    <div className="mx-auto max-w-xl space-y-4 py-12 text-center">
      <h1 className="text-3xl font-bold">No such lesson</h1>
      <p className="text-ink-soft">That lesson is not part of the course, or its address has changed.</p>
      <ButtonLink href="/courses">See the courses</ButtonLink>
    </div>
  );
}
