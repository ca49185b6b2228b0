import type { Metadata } from 'next';
import Link from 'next/link';
import { Badge } from '@/components/ui/badge';
import { getCourses, getLessons } from '@/lib/content';
import { formatFee, formatMinutes } from '@/lib/content/format';

export const metadata: Metadata = {
  title: 'Courses',
  description: 'Courses in safe pickling and boiling-water canning, with lessons, calculators, quizzes and workshops.',
};

export default function CoursesPage() {
  const courses = getCourses().map((course) => {
    const lessons = getLessons(course.slug);
    return { course, lessons: lessons.length, minutes: lessons.reduce((sum, l) => sum + l.minutes, 0), previews: lessons.filter((l) => l.preview).length };
  });
  return (
    <div className="space-y-8">
      <header className="max-w-prose space-y-2">
        <h1 className="text-3xl font-bold">Courses</h1>
        <p className="text-ink-soft">
          Each course is a set of lessons with calculators built in, a quiz after every lesson, and a certificate when you finish. The first lessons of the main
          course are open to everyone.
        </p>
      </header>
      {courses.length === 0 ? (
        <p className="rounded-jar border border-brine-100 bg-white p-5 text-ink-soft">No courses are published yet.</p>
      ) : (
        <ul className="grid gap-6 md:grid-cols-2">
          {courses.map(({ course, lessons, minutes, previews }) => (
            <li key={course.slug} className="flex flex-col rounded-jar border border-brine-100 bg-white p-6 shadow-shelf">
              <div className="mb-3 flex flex-wrap gap-2">
                {course.workshopRequired ? <Badge tone="brine">Includes a workshop</Badge> : <Badge tone="honey">Online only</Badge>}
                {previews ? <Badge tone="copper">{previews === 1 ? '1 free lesson' : `${previews} free lessons`}</Badge> : null}
              </div>
              <h2 className="text-xl font-bold">
                <Link href={`/courses/${course.slug}`} className="text-brine-900 no-underline hover:underline">
                  {course.title}
                </Link>
              </h2>
              <p className="mt-2 flex-1 text-ink-soft">{course.summary}</p>
              <dl className="mt-4 grid grid-cols-3 gap-2 text-sm">
                <div>
                  <dt className="text-ink-soft">Fee</dt>
                  <dd className="font-semibold">{formatFee(course.feeCents, course.currency)}</dd>
                </div>
                <div>
                  <dt className="text-ink-soft">Lessons</dt>
                  <dd className="font-semibold">{lessons}</dd>
                </div>
                <div>
                  <dt className="text-ink-soft">Reading time</dt>
                  <dd className="font-semibold">{formatMinutes(minutes)}</dd>
                </div>
              </dl>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
