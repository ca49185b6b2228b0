import type { Metadata } from 'next';
import Link from 'next/link';

export const metadata: Metadata = { title: 'Privacy' };

export default function PrivacyPage() {
  return (
    <div className="prose mx-auto max-w-2xl space-y-4">
      <h1 className="text-3xl font-bold">Privacy</h1>
      <h2 className="text-xl font-semibold">What we hold about you</h2>
      <p>
        Your name and e-mail address; the courses you enrolled in, your workshop and attendance; the lessons you read; your quiz attempts and answers; your
        practical batches, their photos and the instructors&apos; reviews; your payments (amounts and dates: card numbers stay with the card payment service);
        the certificates issued to you; and a log of what was done on your account.
      </p>
      <h2 className="text-xl font-semibold">Seeing it and taking it with you</h2>
      <p>
        Signed in, open <Link href="/account">your account</Link> and download everything as one ZIP file: a JSON file for each kind of record and your photos
        as stored.
      </p>
      <h2 className="text-xl font-semibold">Deleting your account</h2>
      <p>
        From your account page you can delete your account. Your name, e-mail address, password, lesson progress, quiz attempts, practical batches and photos
        are removed, and every session ends. Three things are kept, with your name replaced by a pseudonym such as “Deleted account #1234”:
      </p>
      <ul className="list-disc pl-5">
        <li>
          <strong>Payments and enrollments</strong>: the program must be able to account for the fees it took and the refunds it made.
        </li>
        <li>
          <strong>Issued certificates</strong>: a certificate is a public statement; anyone holding one must still be able to verify it by its serial, and the
          program must know what it certified.
        </li>
        <li>
          <strong>The audit log</strong>: who issued, revoked or refunded what, and when, so the program&apos;s own records stay trustworthy.
        </li>
      </ul>
      <p>
        Staff accounts (instructors, coordinators, admins) are closed by an admin rather than deleted, because their reviews and decisions are part of other
        people&apos;s records.
      </p>
    </div>
  );
}
