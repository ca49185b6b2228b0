import type { ReactNode } from 'react';
import { SectionNav } from '@/components/section-nav';

// Each page under /desk calls requirePageRole itself; this layout only holds the section links.
const LINKS = [
  { href: '/desk', label: 'Enrollments' },
  { href: '/desk/workshops', label: 'Workshops' },
  { href: '/desk/payments', label: 'Payments and refunds' },
  { href: '/desk/waivers', label: 'Fee waivers' },
  { href: '/desk/reports', label: 'Reports' },
  { href: '/desk/import', label: 'Import holders' },
  { href: '/desk/audit', label: 'Audit log' },
];

export default function DeskLayout({ children }: { children: ReactNode }) {
  return (
    <>
      <SectionNav label="Certificate desk" links={LINKS} />
      {children}
    </>
  );
}
