import type { ErrorType } from '@/lib/errors';

const UNREACHABLE = 'Brinewright could not be reached. Check your connection and try again.';

/**
 * A JSON request that did not succeed, mirroring the server's `AppError` body
 * (`{ error, message, fields?, …extra }`). `status` is 0 when the server could not be reached.
 */
export class FetchError extends Error {
  readonly status: number;
  readonly type: ErrorType | 'network' | 'unknown';
  readonly fields: Record<string, string[]>;
  readonly body: Record<string, unknown>;

  constructor(status: number, body: Record<string, unknown> = {}, message?: string) {
    super(typeof body.message === 'string' ? body.message : (message ?? `The request failed (${status}).`));
    this.name = 'FetchError';
    this.status = status;
    this.type = status === 0 ? 'network' : typeof body.error === 'string' ? (body.error as ErrorType) : 'unknown';
    this.fields = body.fields && typeof body.fields === 'object' ? (body.fields as Record<string, string[]>) : {};
    this.body = body;
  }

  get unreachable(): boolean {
    return this.status === 0;
  }
}

/** The message to show for an error thrown by `fetchJson`, or `fallback` for anything else. */
export function errorMessage(error: unknown, fallback: string): string {
  return error instanceof FetchError ? error.message : fallback;
}

/** fetch + JSON for SWR and client forms: the parsed body, or a FetchError with the server's sentence. */
export async function fetchJson<T>(url: string, init?: RequestInit): Promise<T> {
  let response: Response;
  try {
    response = await fetch(url, {
      ...init,
      // A FormData body sets its own multipart type with the boundary.
      headers: { accept: 'application/json', ...(typeof init?.body === 'string' ? { 'content-type': 'application/json' } : {}), ...(init?.headers ?? {}) },
    });
  } catch {
    throw new FetchError(0, {}, UNREACHABLE);
  }
  const body = (await response.json().catch(() => ({}))) as Record<string, unknown> | null;
  if (!response.ok) throw new FetchError(response.status, body ?? {});
  return body as T;
}

/** POST a JSON body (or none) to a route handler. */
export function postJson<T>(url: string, body?: unknown): Promise<T> {
  return fetchJson<T>(url, { method: 'POST', ...(body === undefined ? {} : { body: JSON.stringify(body) }) });
}

/** POST a multipart form (a file upload) to a route handler. */
export function postForm<T>(url: string, form: FormData): Promise<T> {
  return fetchJson<T>(url, { method: 'POST', body: form });
}
