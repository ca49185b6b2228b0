import { roleAllows, type RoleSet, type Role } from './roles';

export type NavItem = { href: string; label: string; roles: readonly Role[] };

// Public links everyone sees, then the links each role gets once signed in.
export const PUBLIC_NAV: readonly NavItem[] = [
  { href: '/courses', label: 'Courses', roles: [] },
  { href: '/bench', label: 'Brine bench', roles: [] },
  { href: '/verify', label: 'Verify a certificate', roles: [] },
];

// `roles`: who the page's guard lets in (lib/roles.ts implies the rest), so the menu and the guard agree.
export const ROLE_NAV: readonly NavItem[] = [
  { href: '/pantry', label: 'Pantry', roles: ['learner'] },
  { href: '/tasting-table', label: 'Tasting table', roles: ['instructor'] },
  { href: '/desk', label: 'Certificate desk', roles: ['coordinator'] },
  { href: '/admin/users', label: 'Users and roles', roles: ['admin'] },
  { href: '/admin/program', label: 'Program', roles: ['admin'] },
];

export function navFor(roles: RoleSet | null): NavItem[] {
  if (!roles) return [];
  return ROLE_NAV.filter((item) => roleAllows(roles, item.roles));
}
