// Which client address the app sees (the sign-in and verification throttles key on it, through
// clientAddress() in lib/auth/options.ts, which reads the first X-Forwarded-For entry).
//
// Only the app server (server.ts) knows the connection's own address. Unless a proxy in front is
// trusted (TRUST_PROXY=true, and then the proxy must overwrite X-Forwarded-For with the address it
// saw), the headers a client sent are replaced by the connection's address before Next reads them,
// so that nobody chooses their own address for the per-address counts.
import type { IncomingHttpHeaders } from 'node:http';

/** The connection's address as people write it: an IPv4 client on a dual-stack socket without ::ffff:. */
export function socketAddress(remoteAddress: string | undefined): string {
  if (!remoteAddress) return 'unknown';
  return remoteAddress.startsWith('::ffff:') && remoteAddress.includes('.') ? remoteAddress.slice(7) : remoteAddress;
}

/** Sets X-Forwarded-For to the connection's address (dropping X-Real-IP) unless the proxy is trusted. */
export function applyClientAddress(headers: IncomingHttpHeaders, remoteAddress: string | undefined, trustProxy: boolean): void {
  if (trustProxy) return;
  headers['x-forwarded-for'] = socketAddress(remoteAddress);
  delete headers['x-real-ip'];
}
