import type { Role } from './roles';

export type NavItem = { href: string; label: string; roles: readonly Role[] };

// Public links everyone sees, then the links each role gets once signed in.
export const PUBLIC_NAV: readonly NavItem[] = [
  { href: '/courses', label: 'Courses', roles: [] },
  { href: '/bench', label: 'Brine bench', roles: [] },
  { href: '/verify', label: 'Verify a certificate', roles: [] },
];

export const ROLE_NAV: readonly NavItem[] = [
  { href: '/pantry', label: 'Pantry', roles: ['learner'] },
  { href: '/tasting-table', label: 'Tasting table', roles: ['instructor', 'coordinator', 'admin'] },
  { href: '/desk', label: 'Certificate desk', roles: ['coordinator', 'admin'] },
  { href: '/admin/users', label: 'Users and roles', roles: ['admin'] },
  { href: '/admin/program', label: 'Program', roles: ['admin'] },
];

export function navFor(role: Role | null): NavItem[] {
  if (!role) return [];
  return ROLE_NAV.filter((item) => item.roles.includes(role));
}
