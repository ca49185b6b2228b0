import type { ReactNode } from 'react';
import { SectionNav } from '@/components/section-nav';

// Each page under /tasting-table calls requirePageRole itself; this layout only holds the section links.
const LINKS = [
  { href: '/tasting-table', label: 'Practical submissions' },
  { href: '/tasting-table/questions', label: 'Question results' },
  { href: '/tasting-table/workshops', label: 'My workshops' },
];

export default function TastingTableLayout({ children }: { children: ReactNode }) {
  return (
    <>
      <SectionNav label="Tasting table" links={LINKS} />
      {children}
    </>
  );
}
