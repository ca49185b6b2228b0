// Browser-less requests against the running production build: a cookie jar per person and sign-in
// through next-auth's own credentials endpoint (the same POST the sign-in form makes).
import { baseUrl } from './browser';

export type Jar = Map<string, string>;

/** Every Set-Cookie header of a response, one string each. */
export function setCookiesOf(response: Response): string[] {
  return response.headers.getSetCookie();
}

function remember(jar: Jar, response: Response) {
  for (const line of setCookiesOf(response)) {
    const [pair] = line.split(';');
    const eq = pair.indexOf('=');
    const name = pair.slice(0, eq).trim();
    const value = pair.slice(eq + 1).trim();
    if (!value || /max-age=0/i.test(line) || /expires=Thu, 01 Jan 1970/i.test(line)) jar.delete(name);
    else jar.set(name, value);
  }
}

const cookieHeader = (jar: Jar) => [...jar].map(([name, value]) => `${name}=${value}`).join('; ');

export type SendOptions = { method?: string; body?: unknown; headers?: Record<string, string>; jar?: Jar };

/** One request without following redirects; a plain object body is sent as JSON, a string as is. */
export async function send(path: string, { method = 'GET', body, headers = {}, jar }: SendOptions = {}): Promise<Response> {
  const init: RequestInit = { method, redirect: 'manual', headers: { ...headers } };
  const h = init.headers as Record<string, string>;
  if (jar?.size) h.cookie = cookieHeader(jar);
  if (body !== undefined) {
    if (typeof body === 'string' || body instanceof FormData || body instanceof URLSearchParams || body instanceof Uint8Array) init.body = body as BodyInit;
    else {
      init.body = JSON.stringify(body);
      h['content-type'] ??= 'application/json';
    }
  }
  const response = await fetch(new URL(path, baseUrl()), init);
  if (jar) remember(jar, response);
  return response;
}

export type SignedIn = { jar: Jar; signInResponse: Response };

/** Signs in with e-mail and password through /api/auth/callback/credentials; throws when refused. */
export async function signInHttp(email: string, password: string): Promise<SignedIn> {
  const jar: Jar = new Map();
  const csrf = await send('/api/auth/csrf', { jar });
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const form = new URLSearchParams({ csrfToken, email, password, callbackUrl: baseUrl() + '/', json: 'true' });
  const response = await send('/api/auth/callback/credentials', {
    method: 'POST',
    jar,
    body: form.toString(),
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
  });
  const session = [...jar.keys()].find((name) => name.endsWith('next-auth.session-token'));
  if (!session) throw new Error(`sign-in refused for ${email}: ${response.status} ${await response.text()}`);
  return { jar, signInResponse: response };
}
