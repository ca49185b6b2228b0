import type { Metadata } from 'next';
import { PantryCertificates } from '@/components/certificates/pantry-certificates';
import { PantryShelves } from '@/components/pantry/pantry-shelves';
import { PantryPracticals } from '@/components/practicals/pantry-practicals';
import { requirePageRole } from '@/lib/auth/guard';
import { fetchPantry } from '@/lib/progress/pantry';

export const metadata: Metadata = { title: 'Pantry' };

export default async function PantryPage() {
  const user = await requirePageRole('/pantry', 'learner');
  const shelves = await fetchPantry(user.id);
  return (
    <div className="space-y-6">
      <h1 className="text-3xl font-bold">Your Pantry</h1>
      <PantryShelves initial={{ shelves }} />
      <PantryPracticals userId={user.id} />
      <PantryCertificates userId={user.id} />
    </div>
  );
}
