import { describe, expect, it } from 'vitest';
import { navFor } from './nav';
import { describeRoles, formatRoles, normalizeRoles, parseRoles, roleAllows, rolesAllowing } from './roles';

describe('roleAllows', () => {
  it('lets each role act as itself', () => {
    for (const role of ['learner', 'instructor', 'coordinator', 'admin'] as const) expect(roleAllows([role], [role])).toBe(true);
  });
  it('gives coordinators the instructor pages and admins the coordinator pages', () => {
    expect(roleAllows(['coordinator'], ['instructor'])).toBe(true);
    expect(roleAllows(['admin'], ['coordinator'])).toBe(true);
  });
  it('keeps learners out of staff pages, instructors out of the desk and staff out of learner pages', () => {
    expect(roleAllows(['learner'], ['instructor'])).toBe(false);
    expect(roleAllows(['learner'], ['coordinator', 'admin'])).toBe(false);
    expect(roleAllows(['instructor'], ['coordinator'])).toBe(false);
    expect(roleAllows(['coordinator'], ['admin'])).toBe(false);
    expect(roleAllows(['admin'], ['learner'])).toBe(false);
  });
  it('lets a set pass when any role in it allows', () => {
    expect(roleAllows(['learner', 'instructor'], ['learner'])).toBe(true);
    expect(roleAllows(['learner', 'instructor'], ['instructor'])).toBe(true);
    expect(roleAllows(['learner', 'instructor'], ['coordinator'])).toBe(false);
    expect(roleAllows(['instructor', 'coordinator'], ['coordinator'])).toBe(true);
    expect(roleAllows([], ['learner'])).toBe(false);
  });
  it('finds the roles that allow a page, for queries', () => {
    expect(rolesAllowing(['instructor'])).toEqual(['instructor', 'coordinator', 'admin']);
    expect(rolesAllowing(['coordinator'])).toEqual(['coordinator', 'admin']);
    expect(rolesAllowing(['learner'])).toEqual(['learner']);
  });
});

describe('role sets in the database and on screen', () => {
  it("reads MariaDB's SET value and writes it back in one order", () => {
    expect(parseRoles('learner,instructor')).toEqual(['learner', 'instructor']);
    expect(parseRoles('')).toEqual([]);
    expect(parseRoles('superuser,admin')).toEqual(['admin']);
    expect(parseRoles(['admin', 'learner', 'admin'])).toEqual(['learner', 'admin']);
    expect(formatRoles(['admin', 'learner'])).toBe('learner,admin');
    expect(normalizeRoles(['coordinator', 'instructor', 'coordinator'])).toEqual(['instructor', 'coordinator']);
  });
  it('names a set most senior first', () => {
    expect(describeRoles(['learner', 'instructor'])).toBe('Instructor and learner');
    expect(describeRoles(['admin'])).toBe('Admin');
    expect(describeRoles(['learner', 'instructor', 'coordinator'])).toBe('Coordinator, instructor and learner');
    expect(describeRoles([])).toBe('No role');
  });
});

describe('navFor', () => {
  it('shows each set of roles its own pages', () => {
    expect(navFor(null)).toEqual([]);
    expect(navFor(['learner']).map((i) => i.label)).toEqual(['Pantry']);
    expect(navFor(['instructor']).map((i) => i.label)).toEqual(['Tasting table']);
    expect(navFor(['coordinator']).map((i) => i.label)).toEqual(['Tasting table', 'Certificate desk']);
    expect(navFor(['admin']).map((i) => i.label)).toEqual(['Tasting table', 'Certificate desk', 'Users and roles', 'Program']);
    expect(navFor(['learner', 'instructor']).map((i) => i.label)).toEqual(['Pantry', 'Tasting table']);
  });
});
