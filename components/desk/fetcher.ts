/** An error from a JSON route, with its status and the server's message. */
export class FetchError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly body: unknown,
  ) {
    super(message);
  }
}

async function parse(response: Response) {
  const body = await response.json().catch(() => null);
  if (!response.ok) throw new FetchError((body as { message?: string } | null)?.message ?? `Request failed (${response.status}).`, response.status, body);
  return body;
}

/** The SWR fetcher of the desk: JSON or a FetchError carrying the server's message. */
export const fetchJson = async <T>(url: string): Promise<T> => parse(await fetch(url, { headers: { accept: 'application/json' } })) as Promise<T>;

export const postJson = async <T>(url: string, body: unknown): Promise<T> =>
  parse(await fetch(url, { method: 'POST', headers: { 'content-type': 'application/json', accept: 'application/json' }, body: JSON.stringify(body) })) as Promise<T>;
