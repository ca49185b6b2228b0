import crypto from 'node:crypto';

// A stateless e-mail confirmation token: user id, expiry and an HMAC over both and the address,
// so a token stops working if the address changes, and no table is needed.
const sign = (secret: string, payload: string) => crypto.createHmac('sha256', secret).update(payload).digest('base64url');

export function confirmationToken({ userId, email, secret, expiresAt }: { userId: number; email: string; secret: string; expiresAt: Date }): string {
  const exp = Math.floor(expiresAt.getTime() / 1000);
  return `${userId}.${exp}.${sign(secret, `confirm-email|${userId}|${email.toLowerCase()}|${exp}`)}`;
}

export type TokenCheck = { ok: true; userId: number } | { ok: false; reason: 'malformed' | 'expired' | 'mismatch' };

/** Reads a token; `emailFor` gives the current address of the user it names. */
export async function checkConfirmationToken(
  token: string,
  secret: string,
  emailFor: (userId: number) => Promise<string | null>,
  now = new Date(),
): Promise<TokenCheck> {
  const m = /^(\d+)\.(\d+)\.([\w-]{43})$/.exec(token);
  if (!m) return { ok: false, reason: 'malformed' };
  const userId = Number(m[1]);
  const exp = Number(m[2]);
  const email = await emailFor(userId);
  if (!email) return { ok: false, reason: 'mismatch' };
  const expected = Buffer.from(sign(secret, `confirm-email|${userId}|${email.toLowerCase()}|${exp}`));
  const given = Buffer.from(m[3]);
  if (expected.length !== given.length || !crypto.timingSafeEqual(expected, given)) return { ok: false, reason: 'mismatch' };
  if (exp * 1000 <= now.getTime()) return { ok: false, reason: 'expired' };
  return { ok: true, userId };
}
