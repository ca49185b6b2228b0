import { afterEach, describe, expect, it, vi } from 'vitest';
import { AppError } from '@/lib/errors';
import { errorMessage, FetchError, fetchJson, postJson } from './fetcher';

afterEach(() => vi.unstubAllGlobals());

describe('fetchJson', () => {
  it('returns the body of a 2xx answer and sends JSON with a POST', async () => {
    const fetch = vi.fn(async () => Response.json({ ok: 1 }, { status: 201 }));
    vi.stubGlobal('fetch', fetch);
    await expect(postJson('/api/x', { a: 1 })).resolves.toEqual({ ok: 1 });
    expect(fetch).toHaveBeenCalledWith('/api/x', {
      method: 'POST',
      body: '{"a":1}',
      headers: { accept: 'application/json', 'content-type': 'application/json' },
    });
  });

  it('mirrors the server’s AppError body: status, type, message, fields and the rest', async () => {
    const server = new AppError('bad_request', 'Check the fields.', {
      fields: { email: ['Enter an e-mail address.'] },
      extra: { nextAttemptAt: '2026-12-05' },
    });
    vi.stubGlobal('fetch', async () => server.toResponse());
    const error = await fetchJson('/api/x').catch((e: unknown) => e);
    expect(error).toBeInstanceOf(FetchError);
    expect(error).toMatchObject({
      status: 400,
      type: 'bad_request',
      message: 'Check the fields.',
      fields: { email: ['Enter an e-mail address.'] },
      unreachable: false,
    });
    expect((error as FetchError).body.nextAttemptAt).toBe('2026-12-05');
  });

  it('names the status when the answer is not JSON, and status 0 when the server cannot be reached', async () => {
    vi.stubGlobal('fetch', async () => new Response('<html>bad gateway</html>', { status: 502 }));
    await expect(fetchJson('/api/x')).rejects.toMatchObject({ status: 502, type: 'unknown', message: 'The request failed (502).' });
    vi.stubGlobal('fetch', async () => {
      throw new TypeError('Failed to fetch');
    });
    const error = await fetchJson('/api/x').catch((e: unknown) => e);
    expect(error).toMatchObject({ status: 0, type: 'network', unreachable: true });
    expect(errorMessage(error, 'fallback')).toMatch(/could not be reached/);
    expect(errorMessage(new Error('boom'), 'fallback')).toBe('fallback');
  });
});
