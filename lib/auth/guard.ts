import 'server-only';
import { cookies } from 'next/headers';
import { forbidden, redirect } from 'next/navigation';
import { getEnv } from '@/lib/env';
import { AppError } from '@/lib/errors';
import { roleAllows, type Role } from '@/lib/roles';
import { userFromCookies, usesSecureCookies } from './session';
import { sessionIsLive } from './sessions';
import { currentAccount, type SessionUser } from './users';

/**
 * The signed-in user, or null: next-auth's session cookie decoded with next-auth's own `decode`
 * (lib/auth/session.ts), without running the NextAuth handler on every request. The roles are the
 * ones the database holds now, not the one written into the token at sign-in: roles an admin
 * changes apply from the user's next request; an account that no longer exists or is deactivated,
 * a session from before a password change or "sign out everywhere", and a sign-in older than
 * SESSION_MAX_DAYS are signed out. That is one primary-key read per check.
 */
export async function getCurrentUser(): Promise<SessionUser | null> {
  // cookies() first: it marks the page dynamic before the configuration is read (no prerendering).
  const jar = (await cookies()).getAll();
  const env = getEnv();
  const fromToken = await userFromCookies(jar, { secret: env.NEXTAUTH_SECRET, secure: usesSecureCookies(env.NEXTAUTH_URL) });
  if (!fromToken) return null;
  const account = await currentAccount(fromToken.id);
  if (!account || !sessionIsLive(fromToken, account, { nowSeconds: Date.now() / 1000, maxAgeDays: env.SESSION_MAX_DAYS })) return null;
  return { id: fromToken.id, email: fromToken.email, name: fromToken.name, roles: account.roles };
}

/**
 * The one check every protected route handler, server action and page makes.
 * Signed out: AppError 401. Signed in without any role that allows one of `allowed`: AppError 403
 * (a user passes when any role they hold allows it). With no roles given, any signed-in user passes.
 */
export async function requireRole(...allowed: Role[]): Promise<SessionUser> {
  const user = await getCurrentUser();
  if (!user) throw new AppError('unauthorized');
  if (allowed.length && !roleAllows(user.roles, allowed)) throw new AppError('forbidden');
  return user;
}

/** requireRole for pages: the sign-in page when signed out, the friendly 403 page for the wrong role. */
export async function requirePageRole(callbackPath: string, ...allowed: Role[]): Promise<SessionUser> {
  try {
    return await requireRole(...allowed);
  } catch (error) {
    if (error instanceof AppError && error.type === 'unauthorized') redirect(`/signin?callbackUrl=${encodeURIComponent(callbackPath)}`);
    if (error instanceof AppError && error.type === 'forbidden') forbidden();
    throw error;
  }
}
