/** An HTTP answer that is not 2xx, with the server's message and body. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly body: Record<string, unknown> = {},
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

/** fetch + JSON for SWR and forms: throws HttpError with the server's sentence on a non-2xx answer. */
export async function fetchJson<T>(url: string, init?: RequestInit): Promise<T> {
  let response: Response;
  try {
    response = await fetch(url, { ...init, headers: { accept: 'application/json', ...(init?.body ? { 'content-type': 'application/json' } : {}), ...(init?.headers ?? {}) } });
  } catch {
    throw new HttpError(0, 'Brinewright could not be reached. Check your connection and try again.');
  }
  const body = (await response.json().catch(() => ({}))) as Record<string, unknown>;
  if (!response.ok) {
    const message = typeof body.message === 'string' ? body.message : `The request failed (${response.status}).`;
    throw new HttpError(response.status, message, body);
  }
  return body as T;
}
