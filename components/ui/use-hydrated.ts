'use client';

import { useSyncExternalStore } from 'react';

const subscribe = () => () => {};

/**
 * False in the server's HTML and while React hydrates it, true from then on (and at once for a
 * component first rendered in the browser). Inputs whose state React keeps are disabled until
 * then: a value typed into the server's HTML before hydration would show in the field while the
 * result was computed from the initial state, and a form submitted before its handler is attached
 * would go to the server as a plain form.
 */
export function useHydrated(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => true,
    () => false,
  );
}
