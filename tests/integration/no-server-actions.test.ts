import { describe, expect, it } from 'vitest';
import { discoverRoutes } from '../support/app-routes';
import { MATRIX } from '../e2e/support/authorization-matrix';

// Every write the browser sends is a route handler (DEVELOPERS.md, "Writing from a form"): one guard
// call, one row shape in the authorization matrix and the bad-input sweep. A server action added
// under app/ would bypass both, so this fails until it is moved to app/api/.
describe('server actions', () => {
  it('app/ has none, and the authorization matrix lists none', () => {
    const actions = discoverRoutes().flatMap((r) => (r.kind === 'action' ? r.actions.map((a) => `${r.pattern} ${a}`) : []));
    expect(actions).toEqual([]);
    expect(MATRIX.filter((r) => r.kind === 'action')).toEqual([]);
  });
});
