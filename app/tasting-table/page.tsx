import type { Metadata } from 'next';
import { Card } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/guard';
import { db } from '@/models';

export const metadata: Metadata = { title: 'Tasting table' };

export default async function TastingTablePage() {
  await requirePageRole('/tasting-table', 'instructor');
  const waiting = await db().Practical.count({ where: { status: 'submitted' } });
  return (
    <div className="space-y-6">
      <h1 className="text-3xl font-bold">Tasting table</h1>
      <Card>
        <p className="text-ink-soft">
          {waiting === 0 ? 'No practical batches are waiting for review.' : `${waiting} practical batch${waiting === 1 ? ' is' : 'es are'} waiting for review.`}
        </p>
      </Card>
    </div>
  );
}
