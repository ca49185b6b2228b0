import 'server-only';
import { decode } from 'next-auth/jwt';
import { isRole, parseRoles, type Role } from '@/lib/roles';
import type { SessionStamp } from './sessions';
import type { SessionUser } from './users';

// Reads the signed-in user straight from next-auth's session cookie, with next-auth's own `decode`
// (the same secret, cookie name and expiry check as its session route), instead of running the whole
// NextAuth handler through getServerSession on every request (which also re-encrypts a fresh token
// each call, only to throw it away in a route handler). Nothing is written: the rolling refresh of
// the cookie stays with /api/auth/session, which the browser's SessionProvider calls.

export type CookieLike = { name: string; value: string };

/** next-auth's session cookie name: `__Secure-` prefixed when the app's address is https. */
export function sessionCookieName(secure: boolean): string {
  return `${secure ? '__Secure-' : ''}next-auth.session-token`;
}

/** Whether next-auth uses secure cookies for this address (its rule: NEXTAUTH_URL starts with https://). */
export function usesSecureCookies(nextAuthUrl: string | undefined): boolean {
  return (nextAuthUrl ?? '').startsWith('https://');
}

/**
 * The session token from the cookies: next-auth splits a long token into `name.0`, `name.1`, …;
 * like its SessionStore, every cookie whose name starts with the session cookie's name is taken,
 * ordered by the numeric suffix, and joined.
 */
export function sessionTokenFrom(cookies: readonly CookieLike[], secure: boolean): string {
  const name = sessionCookieName(secure);
  const parts = cookies.filter((c) => c.name.startsWith(name));
  const suffix = (n: string) => parseInt(n.split('.').pop() ?? '0', 10);
  return parts
    .sort((a, b) => suffix(a.name) - suffix(b.name))
    .map((c) => c.value)
    .join('');
}

/**
 * The user the session cookie names, or null: no cookie, a token that does not decrypt with the
 * secret, an expired token (jose checks `exp`, with next-auth's 15 s clock tolerance), or claims
 * that are not a user of known roles. The roles are the ones in the token, written at sign-in;
 * getCurrentUser (lib/auth/guard.ts) replaces them with the roles the database holds now, and checks
 * the stamp (session version, sign-in time) against the account (lib/auth/sessions.ts).
 */
export async function userFromCookies(
  cookies: readonly CookieLike[],
  options: { secret: string; secure: boolean },
): Promise<(SessionUser & SessionStamp) | null> {
  const token = sessionTokenFrom(cookies, options.secure);
  if (!token) return null;
  const claims = await decodeCached(token, options.secret);
  if (!claims || typeof claims.uid !== 'number') return null;
  const roles = tokenRoles(claims);
  if (!roles) return null;
  // A token without a stamp (written before sessions had versions) counts as version 0, signed in when issued.
  const sessionVersion = typeof claims.sv === 'number' ? claims.sv : 0;
  const signedInAt = typeof claims.sat === 'number' ? claims.sat : typeof claims.iat === 'number' ? claims.iat : 0;
  return { id: claims.uid, email: claims.email ?? '', name: claims.name ?? '', roles, sessionVersion, signedInAt };
}

/**
 * The roles a token names: `roles` (a set), or the single `role` of a token written before accounts
 * held sets, read for one release so nobody is signed out by the upgrade; the guard uses the
 * database's roles either way. Null when neither names a known role.
 */
export function tokenRoles(claims: { roles?: unknown; role?: unknown }): Role[] | null {
  if (Array.isArray(claims.roles)) {
    const roles = parseRoles(claims.roles);
    return roles.length === claims.roles.length ? roles : null;
  }
  return isRole(claims.role) ? [claims.role] : null;
}

type Claims = NonNullable<Awaited<ReturnType<typeof decode>>>;

/** next-auth's clock tolerance when it checks `exp` (jwtDecrypt's clockTolerance in next-auth/jwt). */
const CLOCK_TOLERANCE_S = 15;
const MAX_CACHED = 1000;
// Tokens this process has decrypted, with their claims: a browser sends the same token on every
// request, and the key derivation and decryption were the costliest part of reading the session.
// Only a token that decrypted with the secret gets here; its expiry is checked again on every use.
const decoded = new Map<string, Claims>();
let decodedFor = '';

async function decodeCached(token: string, secret: string): Promise<Claims | null> {
  if (decodedFor !== secret) {
    decoded.clear();
    decodedFor = secret;
  }
  const hit = decoded.get(token);
  if (hit) {
    if (typeof hit.exp === 'number' && hit.exp + CLOCK_TOLERANCE_S > Date.now() / 1000) return hit;
    decoded.delete(token);
    return null;
  }
  let claims: Claims | null;
  try {
    claims = await decode({ token, secret });
  } catch {
    return null;
  }
  if (!claims) return null;
  if (decoded.size >= MAX_CACHED) decoded.delete(decoded.keys().next().value!);
  decoded.set(token, claims);
  return claims;
}
