export const ROLES = ['learner', 'instructor', 'coordinator', 'admin'] as const;
export type Role = (typeof ROLES)[number];

// What each role may do beyond its own: an admin is a coordinator plus user management,
// a coordinator may do what an instructor does.
const IMPLIED: Record<Role, readonly Role[]> = {
  learner: ['learner'],
  instructor: ['instructor'],
  coordinator: ['coordinator', 'instructor'],
  admin: ['admin', 'coordinator', 'instructor'],
};

/** True when a user holding `role` may act as any of `allowed`. */
export function roleAllows(role: Role, allowed: readonly Role[]): boolean {
  return IMPLIED[role].some((r) => allowed.includes(r));
}

export const ROLE_LABELS: Record<Role, string> = {
  learner: 'Learner',
  instructor: 'Instructor',
  coordinator: 'Coordinator',
  admin: 'Admin',
};
