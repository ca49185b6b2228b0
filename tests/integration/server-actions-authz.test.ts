import { beforeEach, describe, expect, it, vi } from 'vitest';
import { saveProgramAction } from '@/app/admin/program/actions';
import { importAction, previewImportAction } from '@/app/desk/import/actions';
import { saveWorkshopAction } from '@/app/desk/workshops/actions';
import type { SessionUser } from '@/lib/auth/users';
import { AppError } from '@/lib/errors';
import { discoverRoutes } from '../support/app-routes';
import { MATRIX, SUBJECTS, type ActionExpected, type ActionRow, type Subject } from '../e2e/support/authorization-matrix';
import { createCourses, createUser, resetDatabase } from '../support/db';
import { actAs } from '../support/session';

// Server actions are called as functions with each person signed in (actAs), against the rows of the
// same authorization matrix the browser-less walk uses. Next's revalidatePath needs a request scope.
vi.mock('next/cache', async (importOriginal) => ({ ...(await importOriginal<typeof import('next/cache')>()), revalidatePath: vi.fn() }));

type People = Record<Exclude<Subject, 'visitor'>, SessionUser> & { target: SessionUser };

/** One call per action, as the page would make it, for the signed-in person; returns what came back or the status it was refused with. */
const CALLS: Record<string, (people: People) => Promise<unknown>> = {
  // The program page with nothing filled in: the admin gets the field errors back.
  '/admin/program saveProgramAction': () => saveProgramAction({}, new FormData()),
  // The import page with no file: the coordinator is asked for one; nothing is read or written.
  '/desk/import importAction': () => importAction({ step: 'upload' }, new FormData()),
  '/desk/import previewImportAction': () => previewImportAction({ step: 'upload' }, new FormData()),
  // A new workshop with nothing filled in: the coordinator gets the field errors back.
  '/desk/workshops saveWorkshopAction': () => saveWorkshopAction(null, {} as Parameters<typeof saveWorkshopAction>[1]),
};

async function outcome(call: () => Promise<unknown>): Promise<{ result: ActionExpected; value?: unknown }> {
  try {
    return { result: 'pass', value: await call() };
  } catch (error) {
    if (error instanceof AppError && (error.status === 401 || error.status === 403)) return { result: error.status as 401 | 403 };
    throw error;
  }
}

const actionRows = MATRIX.filter((r): r is ActionRow => r.kind === 'action');

describe('server actions in the authorization matrix', () => {
  let people: People;

  beforeEach(async () => {
    await resetDatabase();
    await createCourses();
    people = {
      own: await createUser('learner'),
      other: await createUser('learner'),
      instructor: await createUser('instructor'),
      coordinator: await createUser('coordinator'),
      admin: await createUser('admin'),
      volunteer: await createUser(['learner', 'instructor']),
      target: await createUser('learner'),
    };
    actAs(null);
  });

  it('has a call for every server action in app/ (and the matrix lists each)', () => {
    const discovered = discoverRoutes().flatMap((r) => (r.kind === 'action' ? r.actions.map((a) => `${r.pattern} ${a}`) : []));
    expect(discovered.sort()).toEqual(Object.keys(CALLS).sort());
    expect(actionRows.map((r) => `${r.pattern} ${r.action}`).sort()).toEqual(Object.keys(CALLS).sort());
  });

  for (const row of actionRows) {
    it(`${row.pattern} ${row.action}: ${SUBJECTS.map((s) => `${s} ${row.expect[s]}`).join(', ')}`, async () => {
      const got: Record<string, ActionExpected> = {};
      const wanted: Record<string, ActionExpected> = {};
      for (const subject of SUBJECTS) {
        if (row.expect[subject] === 'n/a') continue;
        actAs(subject === 'visitor' ? null : people[subject]);
        const { result, value } = await outcome(() => CALLS[`${row.pattern} ${row.action}`](people));
        got[subject] = result;
        wanted[subject] = row.expect[subject];
        // Let through means the action ran: it answers with its own state object.
        if (result === 'pass') expect(value, `${row.action} as ${subject}`).toMatchObject({ message: expect.any(String) });
      }
      expect(got).toEqual(wanted);
    });
  }
});
