import type { Metadata } from 'next';
import Link from 'next/link';
import { Badge } from '@/components/ui/badge';
import { ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/guard';
import { fetchLearnerEnrollments } from '@/lib/data/foundation';

export const metadata: Metadata = { title: 'Pantry' };

const STATUS_LABEL = { awaiting_payment: 'Awaiting payment', active: 'Active', completed: 'Completed', withdrawn: 'Withdrawn' } as const;

export default async function PantryPage() {
  const user = await requirePageRole('/pantry', 'learner');
  const enrollments = await fetchLearnerEnrollments({ userId: user.id });
  return (
    <div className="space-y-6">
      <h1 className="text-3xl font-bold">Your Pantry</h1>
      {enrollments.length === 0 ? (
        <Card>
          <p className="mb-4 text-ink-soft">Your shelf is empty. Pick a course to start filling it.</p>
          <ButtonLink href="/courses">Browse courses</ButtonLink>
        </Card>
      ) : (
        <ul className="grid gap-4 md:grid-cols-2">
          {enrollments.map((e) => (
            <li key={e.id}>
              <Card title={<Link href={`/courses/${e.courseSlug}`}>{e.courseTitle}</Link>}>
                <Badge tone={e.status === 'active' ? 'brine' : e.status === 'withdrawn' ? 'beet' : 'honey'}>{STATUS_LABEL[e.status]}</Badge>
              </Card>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
