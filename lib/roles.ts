export const ROLES = ['learner', 'instructor', 'coordinator', 'admin'] as const;
export type Role = (typeof ROLES)[number];
/** The roles an account holds: any set of ROLES (a volunteer instructor is also a learner). */
export type RoleSet = readonly Role[];

// What each role may do beyond its own: an admin is a coordinator plus user management,
// a coordinator may do what an instructor does. A learner's pages are a learner's only.
const IMPLIED: Record<Role, readonly Role[]> = {
  learner: ['learner'],
  instructor: ['instructor'],
  coordinator: ['coordinator', 'instructor'],
  admin: ['admin', 'coordinator', 'instructor'],
};

export const isRole = (value: unknown): value is Role => typeof value === 'string' && (ROLES as readonly string[]).includes(value);

/** True when a user holding `roles` may act as any of `allowed`: one held role that allows it is enough. */
export function roleAllows(roles: RoleSet, allowed: readonly Role[]): boolean {
  return roles.some((role) => IMPLIED[role].some((r) => allowed.includes(r)));
}

/** A role set in ROLES order without repeats, so two equal sets compare and print the same. */
export function normalizeRoles(roles: Iterable<string>): Role[] {
  const held = new Set(roles);
  return ROLES.filter((r) => held.has(r));
}

/** The roles of MariaDB's SET column (`'learner,instructor'`, or an array from the model's getter); unknown names are dropped. */
export function parseRoles(value: unknown): Role[] {
  if (Array.isArray(value)) return normalizeRoles(value.filter(isRole));
  if (typeof value !== 'string' || value === '') return [];
  return normalizeRoles(value.split(',').filter(isRole));
}

/** The value written to the SET column. */
export const formatRoles = (roles: RoleSet): string => normalizeRoles(roles).join(',');

export const ROLE_LABELS: Record<Role, string> = {
  learner: 'Learner',
  instructor: 'Instructor',
  coordinator: 'Coordinator',
  admin: 'Admin',
};

/** "Instructor and learner": the roles a person holds, most senior first. */
export function describeRoles(roles: RoleSet): string {
  const labels = [...normalizeRoles(roles)].reverse().map((r, i) => (i === 0 ? ROLE_LABELS[r] : ROLE_LABELS[r].toLowerCase()));
  if (labels.length === 0) return 'No role';
  return labels.length === 1 ? labels[0] : `${labels.slice(0, -1).join(', ')} and ${labels[labels.length - 1]}`;
}

/** True when the set holds a staff role (instructor, coordinator, admin): such accounts are closed by an admin, not erased by their holder. */
export const holdsStaffRole = (roles: RoleSet): boolean => roles.some((r) => r !== 'learner');

/** Every role that, held alone, allows one of `allowed` (for finding staff in the database). */
export const rolesAllowing = (allowed: readonly Role[]): Role[] => ROLES.filter((r) => roleAllows([r], allowed));
