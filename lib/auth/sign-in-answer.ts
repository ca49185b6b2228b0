import 'server-only';

/**
 * next-auth answers a sign-in that authorize() refused with 401 and an `?error=Throttled` address;
 * when the throttle refused it (`refusals` holds its Retry-After seconds) the answer becomes 429
 * with a Retry-After header, keeping the body's `url` and the cookies for next-auth's client.
 */
export async function asTooManyAttempts(response: Response, refusals: number[]): Promise<Response> {
  if (!refusals.length || response.status !== 401) return response;
  const body = (await response
    .clone()
    .json()
    .catch(() => ({}))) as Record<string, unknown>;
  const retryAfter = Math.max(...refusals);
  const answer = Response.json(
    { ...body, error: 'rate_limit', message: 'Too many sign-in attempts. Please wait a few minutes and try again.', retryAfterSeconds: retryAfter },
    { status: 429, headers: { 'Retry-After': String(retryAfter) } },
  );
  for (const cookie of response.headers.getSetCookie()) answer.headers.append('set-cookie', cookie);
  return answer;
}
