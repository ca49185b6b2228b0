import 'server-only';
import { getServerSession } from 'next-auth';
import { forbidden, redirect } from 'next/navigation';
import { AppError } from '@/lib/errors';
import { roleAllows, ROLES, type Role } from '@/lib/roles';
import { authOptions } from './options';
import type { SessionUser } from './users';

/** The signed-in user, or null. */
export async function getCurrentUser(): Promise<SessionUser | null> {
  const session = await getServerSession(authOptions());
  const user = session?.user;
  if (!user || typeof user.id !== 'number' || !ROLES.includes(user.role)) return null;
  return user;
}

/**
 * The one check every protected route handler, server action and page makes.
 * Signed out: AppError 401. Signed in with a role that is not allowed: AppError 403.
 * With no roles given, any signed-in user passes.
 */
export async function requireRole(...allowed: Role[]): Promise<SessionUser> {
  const user = await getCurrentUser();
  if (!user) throw new AppError('unauthorized');
  if (allowed.length && !roleAllows(user.role, allowed)) throw new AppError('forbidden');
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
