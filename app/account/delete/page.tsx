import type { Metadata } from 'next';
import Link from 'next/link';
import { DeleteAccountForm } from '@/components/account/account-forms';
import { Card } from '@/components/ui/card';
import { erasurePreview, STAFF_DELETION } from '@/lib/account/data';
import { requirePageRole } from '@/lib/auth/guard';
import { holdsStaffRole } from '@/lib/roles';

export const metadata: Metadata = { title: 'Delete your account' };

const count = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

export default async function DeleteAccountPage() {
  const user = await requirePageRole('/account/delete', 'learner');
  const preview = await erasurePreview(user.id);
  return (
    <div className="mx-auto max-w-2xl space-y-6">
      <h1 className="text-3xl font-bold">Delete your account</h1>
      <p>
        Before you go, you may <a href="/api/account/export">download everything we hold about you</a>. Deleting cannot be undone.
      </p>
      <Card title="What is removed">
        <ul className="list-disc space-y-1 pl-5">
          <li>Your name and e-mail address, and your password: you can no longer sign in.</li>
          <li>Lessons read, {count(preview.attempts, 'quiz attempt')} and your answers.</li>
          <li>
            {count(preview.practicals, 'practical batch', 'practical batches')} with the instructors&apos; reviews, and {count(preview.photos, 'photo')}.
          </li>
          <li>Messages waiting to be sent to you, and open links for your account.</li>
        </ul>
      </Card>
      <Card title="What the program keeps, under the name “{preview.pseudonym}”">
        <ul className="list-disc space-y-1 pl-5">
          <li>
            {count(preview.payments, 'payment')} and {count(preview.enrollments, 'enrollment')}: the program must keep its accounts.
          </li>
          <li>
            {count(preview.certificates, 'issued certificate')}: anyone holding one may still verify it by its serial; it will show the pseudonym, not your
            name.
          </li>
          <li>The audit log of what was done on your account and by whom.</li>
        </ul>
        <p className="mt-3 text-sm text-ink-soft">
          <Link href="/privacy">Why these are kept</Link>.
        </p>
      </Card>
      <Card title="Delete my account">{holdsStaffRole(user.roles) ? <p role="note">{STAFF_DELETION}</p> : <DeleteAccountForm />}</Card>
    </div>
  );
}
