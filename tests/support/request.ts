/** A JSON request for calling a route handler directly. */
export function jsonRequest(url: string, body: unknown, init: RequestInit = {}): Request {
  return new Request(new URL(url, 'http://localhost:3000'), {
    method: 'POST',
    headers: { 'content-type': 'application/json', ...(init.headers ?? {}) },
    body: typeof body === 'string' ? body : JSON.stringify(body),
    ...init,
  });
}

/** The context object Next passes to a dynamic route handler. */
export const params = <T extends Record<string, string | string[]>>(value: T) => ({ params: Promise.resolve(value) });
