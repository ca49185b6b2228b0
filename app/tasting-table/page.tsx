import type { Metadata } from 'next';
import { SubmissionsTable } from '@/components/tasting-table/submissions-table';
import { requirePageRole } from '@/lib/auth/guard';
import { fetchWorkshopOptions } from '@/lib/practicals/data';

export const metadata: Metadata = { title: 'Tasting table' };

export default async function TastingTablePage() {
  await requirePageRole('/tasting-table', 'instructor');
  const workshops = await fetchWorkshopOptions();
  return (
    <div className="space-y-6">
      <header className="space-y-1">
        <h1 className="text-3xl font-bold">Tasting table</h1>
        <p className="text-ink-soft">
          Practical batches from learners, with the automatic checks already run. Open one to see its photos, fill in the rubric and decide.
        </p>
      </header>
      <SubmissionsTable workshops={workshops} />
    </div>
  );
}
