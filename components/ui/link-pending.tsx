'use client';

import { useLinkStatus } from 'next/link';

/**
 * Put inside a `<Link>` (it must be a descendant): while the navigation that link started waits
 * for the server, a thin bar runs under the link's text. Pages rendered per request have no
 * `loading.tsx` (their 401, 403 and 404 statuses must be sent before anything streams), so this
 * is how a click shows that it was taken. The bar appears only after 150 ms, so a quick page
 * shows nothing; the link keeps its size (no layout shift).
 */
export function LinkPending() {
  const { pending } = useLinkStatus();
  if (!pending) return null;
  return <span aria-hidden="true" data-link-pending className="link-pending pointer-events-none absolute inset-x-0 -bottom-1 h-0.5 rounded-full bg-current" />;
}
