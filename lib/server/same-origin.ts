const UNSAFE_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

export const CROSS_SITE_MESSAGE = 'Brinewright does not accept changes sent from another website. Open Brinewright itself and try again there.';

/**
 * Whether a request that changes something came from a page of another site, as the browser tells
 * it: Sec-Fetch-Site when sent, else the Origin header against the app's own origins. A request
 * with neither header (a script, a test, the payment service) is let through; its cookies were not
 * sent by a browser on someone's behalf.
 */
export function isCrossSite(request: Request, appOrigins: () => readonly string[]): boolean {
  if (!UNSAFE_METHODS.has(request.method.toUpperCase())) return false;
  const site = request.headers.get('sec-fetch-site');
  if (site) return site !== 'same-origin' && site !== 'none';
  const origin = request.headers.get('origin');
  if (origin === null) return false;
  if (origin === new URL(request.url).origin) return false;
  return !appOrigins().includes(origin);
}
