import Link from 'next/link';
import { DemoMailboxLink } from '@/components/enrollment/demo-mailbox-link';

export function SiteFooter() {
  return (
    <footer data-site-footer className="mt-16 border-t border-brine-100 bg-paper-deep">
      <div className="mx-auto grid max-w-6xl gap-6 px-4 py-8 text-sm text-ink-soft md:grid-cols-[2fr_1fr]">
        <section aria-labelledby="safety-caution">
          <h2 id="safety-caution" className="mb-2 text-base font-bold">
            Food-safety caution
          </h2>
          <p>
            Brinewright teaches and checks arithmetic; it never calls a recipe safe. Follow a tested recipe from a recognised food-safety authority exactly,
            follow your local codes and the advice of your local extension service, and defer to licensed practice. Home-canned food that is under-acidified or
            under-processed can carry botulism, which can kill. When in doubt, throw it out without tasting it.
          </p>
        </section>
        <nav aria-label="Footer" className="flex flex-col gap-1">
          <Link href="/courses">Courses</Link>
          <Link href="/bench">Brine bench</Link>
          <Link href="/verify">Verify a certificate</Link>
          <DemoMailboxLink />
        </nav>
      </div>
    </footer>
  );
}
