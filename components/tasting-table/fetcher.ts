/** A failed JSON request, with the server's message and status. */
export class FetchError extends Error {
  constructor(
    message: string,
    readonly status: number,
  ) {
    super(message);
    this.name = 'FetchError';
  }
}

export async function jsonFetcher<T>(url: string): Promise<T> {
  const response = await fetch(url, { headers: { accept: 'application/json' } });
  const body = await response.json().catch(() => null);
  if (!response.ok) throw new FetchError(body?.message ?? `The request failed (${response.status}).`, response.status);
  return body as T;
}
