import Link from 'next/link';
import { LinkPending } from '@/components/ui/link-pending';

export type SectionLink = { href: string; label: string };

/** The second row of links inside a staff area (Certificate desk, Tasting table). */
export function SectionNav({ label, links }: { label: string; links: readonly SectionLink[] }) {
  return (
    <nav aria-label={label} className="mb-6 flex flex-wrap gap-2 border-b border-brine-100 pb-3" data-no-print>
      {links.map((link) => (
        <Link key={link.href} href={link.href} className="relative rounded-lg px-3 py-1.5 text-sm font-semibold text-brine-800 no-underline hover:bg-brine-50">
          {link.label}
          <LinkPending />
        </Link>
      ))}
    </nav>
  );
}
