import 'server-only';
import type { NextRequest } from 'next/server';
import { AppError, type ErrorType } from '@/lib/errors';

// Bad input that next-auth 4 itself would answer with a 500 (a malformed JSON body, a callback URL
// that is not http(s): its "server configuration" error, an error code it cannot put in a
// Location header) is refused here with a 400 before next-auth sees it; its plain-text 4xx answers
// are given the app's JSON shape. Used only by app/api/auth/[...nextauth]/route.ts.

const CALLBACK_COOKIES = ['next-auth.callback-url', '__Secure-next-auth.callback-url'];
const BAD_CALLBACK = 'The return address after sign-in must be a page of this site (a path such as /pantry, or an http(s) address).';

/** next-auth's own rule for a callback URL: http(s), or a path on this site. */
function isHttpUrl(value: string, base: string): boolean {
  try {
    return /^https?:/.test(new URL(value, value.startsWith('/') ? base : undefined).protocol);
  } catch {
    return false;
  }
}

const TYPE_BY_STATUS: Record<number, ErrorType> = {
  400: 'bad_request',
  401: 'unauthorized',
  403: 'forbidden',
  404: 'not_found',
  413: 'too_large',
  415: 'unsupported_media',
  429: 'rate_limit',
};

/** next-auth answers some 4xx with plain text or an empty `{}`: give them the app's JSON shape. */
export async function withClearError(response: Response): Promise<Response> {
  if (response.status < 400 || response.status >= 500) return response;
  const text = await response.clone().text();
  let body: { error?: unknown; message?: unknown; url?: unknown } | null = null;
  try {
    body = JSON.parse(text);
    if (typeof body?.error === 'string' && typeof body?.message === 'string') return response;
  } catch {
    /* not JSON: replaced below */
  }
  const type = TYPE_BY_STATUS[response.status] ?? 'bad_request';
  let answer: Response;
  if (body && typeof body.url === 'string') {
    // A failed sign-in (json=true): the client reads `url` (its ?error= code), so it stays.
    const code = URL.canParse(body.url) ? new URL(body.url).searchParams.get('error') : null;
    const message =
      code === 'Throttled'
        ? 'Too many sign-in attempts. Please wait a few minutes and try again.'
        : 'That e-mail address and password do not match an account.';
    answer = Response.json({ ...body, error: type, message }, { status: response.status });
  } else {
    answer = new AppError(type, 'Sign-in does not accept that request. Use the sign-in form.').toResponse({ status: response.status });
  }
  for (const cookie of response.headers.getSetCookie()) answer.headers.append('set-cookie', cookie);
  return answer;
}

/** Throws AppError 400 for a request next-auth would answer with a 500. */
export async function checkNextAuthRequest(request: NextRequest, params: { nextauth: string[] }): Promise<void> {
  const base = new URL(request.url).origin;
  // Every value: next-auth reads the last one of a repeated parameter.
  const callbackUrls = request.nextUrl.searchParams.getAll('callbackUrl');
  if (callbackUrls.some((url) => url && !isHttpUrl(url, base))) throw new AppError('bad_request', BAD_CALLBACK, { fields: { callbackUrl: [BAD_CALLBACK] } });
  for (const name of CALLBACK_COOKIES) {
    const value = request.cookies.get(name)?.value;
    if (value && !isHttpUrl(value, base))
      throw new AppError('bad_request', `${BAD_CALLBACK} Clear this site's cookies and sign in again.`, { fields: { callbackUrl: [BAD_CALLBACK] } });
  }
  // next-auth copies the error code into a Location header unencoded: a character beyond
  // Latin-1 there makes the Response constructor throw.
  const errorCodes = [...request.nextUrl.searchParams.getAll('error'), ...(params.nextauth?.[0] === 'error' && params.nextauth[1] ? [params.nextauth[1]] : [])];
  if (errorCodes.some((code) => !/^[A-Za-z0-9_-]{0,64}$/.test(code))) {
    throw new AppError('bad_request', 'That is not a sign-in error code Brinewright knows.', { fields: { error: ['letters, digits, - and _ only'] } });
  }
  // next-auth's GET callback of a credentials provider is its own 500 ("not supported").
  if (request.method === 'GET' && params.nextauth?.[0] === 'callback' && params.nextauth[1] === 'credentials') {
    throw new AppError('bad_request', 'Sign in with the sign-in form: this address only takes the form itself.');
  }
  if (request.method === 'POST') {
    // Read as next-auth will (its getBody): JSON or a form. It passes a callbackUrl in the body to
    // new URL() unchecked, so a malformed one would throw.
    const type = request.headers.get('content-type') ?? '';
    let body: unknown = undefined;
    if (type.includes('application/json')) {
      try {
        body = await request.clone().json();
      } catch {
        throw new AppError('bad_request', 'The request body is not valid JSON.', { fields: { body: ['not valid JSON'] } });
      }
    } else if (type.includes('application/x-www-form-urlencoded')) {
      body = Object.fromEntries(new URLSearchParams(await request.clone().text()));
    }
    const bodyCallback = body && typeof body === 'object' ? (body as { callbackUrl?: unknown }).callbackUrl : undefined;
    if (bodyCallback !== undefined && bodyCallback !== null && bodyCallback !== '' && (typeof bodyCallback !== 'string' || !isHttpUrl(bodyCallback, base))) {
      throw new AppError('bad_request', BAD_CALLBACK, { fields: { callbackUrl: [BAD_CALLBACK] } });
    }
  }
}
