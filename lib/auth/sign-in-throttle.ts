import 'server-only';
import { AsyncLocalStorage } from 'node:async_hooks';
import { getEnv } from '@/lib/env';
import { giveBack, take, type Limit } from '@/lib/throttle';

export type SignInKeys = { email: string; address: string };

/** Thrown before the password is checked when the e-mail and address, or the address, is past its limit. */
export class ThrottledError extends Error {
  readonly retryAfterSeconds: number;

  constructor(retryAfterSeconds: number) {
    super('Too many sign-in attempts. Please wait a few minutes and try again.');
    this.name = 'ThrottledError';
    this.retryAfterSeconds = retryAfterSeconds;
  }
}

function limitsFor({ email, address }: SignInKeys) {
  const env = getEnv();
  const windowSeconds = env.SIGNIN_WINDOW_MINUTES * 60;
  const refusing: Limit[] = [
    { bucket: `signin:pair:${address}|${email}`, max: env.SIGNIN_MAX_PER_ACCOUNT_ADDRESS, windowSeconds },
    { bucket: `signin:address:${address}`, max: env.SIGNIN_MAX_PER_ADDRESS, windowSeconds },
  ];
  // Counted from every address but never refusing: a stranger must not be able to lock the owner out.
  const account: Limit = { bucket: `signin:account:${email}`, max: Number.MAX_SAFE_INTEGER, windowSeconds };
  return { refusing, account, all: [...refusing, account] };
}

/** Seconds an attempt on an account waits once it has seen more than SIGNIN_SLOW_AFTER_PER_ACCOUNT in the window. */
export function slowdownSeconds(accountAttempts: number, env: { SIGNIN_SLOW_AFTER_PER_ACCOUNT: number; SIGNIN_SLOW_MAX_SECONDS: number }): number {
  return Math.min(env.SIGNIN_SLOW_MAX_SECONDS, Math.max(0, accountAttempts - env.SIGNIN_SLOW_AFTER_PER_ACCOUNT));
}

const defaultSleep = (ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms));

/**
 * Counts a sign-in attempt, atomically and before any password is compared: throws ThrottledError
 * past a limit, and waits when the account is under attack from many addresses. Returns the
 * function that takes the attempt back after a right password.
 */
export async function countSignInAttempt(keys: SignInKeys, options: { sleep?: (ms: number) => Promise<void>; now?: Date } = {}): Promise<() => Promise<void>> {
  const { refusing, account, all } = limitsFor(keys);
  const verdict = await take(all, options.now);
  if (!verdict.allowed) {
    signInRefusal.getStore()?.push(verdict.retryAfterSeconds);
    throw new ThrottledError(verdict.retryAfterSeconds);
  }
  const seen = verdict.counts.find((c) => c.bucket === account.bucket)?.hits ?? 0;
  const wait = slowdownSeconds(seen, getEnv());
  if (wait > 0) await (options.sleep ?? defaultSleep)(wait * 1000);
  return () => giveBack([...refusing, account]);
}

// The Retry-After of a refused sign-in, handed from authorize() to the route that answers 429.
export const signInRefusal = new AsyncLocalStorage<number[]>();
