import Link from 'next/link';
import { LogoMark } from '@/components/logo';
import { ButtonLink } from '@/components/ui/button';

export default function Forbidden() {
  return (
    <div className="mx-auto max-w-xl space-y-4 py-12 text-center">
      <LogoMark className="mx-auto h-14 w-14" />
      <h1 className="text-3xl font-bold">This page is for other people in the program</h1>
      <p className="text-ink-soft">
        You are signed in, but this page belongs to another part of the program (instructors, the coordinator or the administrator). You can go back to your own
        pages or browse the courses. If you think you should see it, ask your program coordinator to check your account.
      </p>
      <div className="flex flex-wrap justify-center gap-3">
        <ButtonLink href="/">Back to the start</ButtonLink>
        <Link href="/courses" className="self-center font-semibold">
          Browse the courses
        </Link>
      </div>
    </div>
  );
}
