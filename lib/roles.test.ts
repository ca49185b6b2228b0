import { describe, expect, it } from 'vitest';
import { navFor } from './nav';
import { roleAllows } from './roles';

describe('roleAllows', () => {
  it('lets each role act as itself', () => {
    for (const role of ['learner', 'instructor', 'coordinator', 'admin'] as const) expect(roleAllows(role, [role])).toBe(true);
  });
  it('gives coordinators the instructor pages and admins the coordinator pages', () => {
    expect(roleAllows('coordinator', ['instructor'])).toBe(true);
    expect(roleAllows('admin', ['coordinator'])).toBe(true);
  });
  it('keeps learners out of staff pages and instructors out of the desk', () => {
    expect(roleAllows('learner', ['instructor'])).toBe(false);
    expect(roleAllows('learner', ['coordinator', 'admin'])).toBe(false);
    expect(roleAllows('instructor', ['coordinator'])).toBe(false);
    expect(roleAllows('coordinator', ['admin'])).toBe(false);
  });
});

describe('navFor', () => {
  it('shows each role its own pages', () => {
    expect(navFor(null)).toEqual([]);
    expect(navFor('learner').map((i) => i.label)).toEqual(['Pantry']);
    expect(navFor('instructor').map((i) => i.label)).toEqual(['Tasting table']);
    expect(navFor('coordinator').map((i) => i.label)).toEqual(['Tasting table', 'Certificate desk']);
    expect(navFor('admin').map((i) => i.label)).toEqual(['Tasting table', 'Certificate desk', 'Users and roles', 'Program']);
  });
});
