import { describe, expect, it } from 'vitest';
import { isJsonMediaType, JSON_BODY_LIMIT, readBodyBytes, readJson } from './body';

const post = (body: BodyInit | null, headers: Record<string, string> = { 'content-type': 'application/json' }) =>
  new Request('http://x/', { method: 'POST', headers, body, ...(body instanceof ReadableStream ? { duplex: 'half' } : {}) } as RequestInit);

/** A body streamed in 64 KB chunks with no Content-Length, counting how much of it was pulled. */
function streamed(totalBytes: number) {
  const chunk = new Uint8Array(64 * 1024).fill(0x20);
  const pulled = { bytes: 0 };
  const stream = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (pulled.bytes >= totalBytes) return controller.close();
      pulled.bytes += chunk.byteLength;
      controller.enqueue(chunk);
    },
  });
  return { stream, pulled };
}

describe('readJson', () => {
  it('reads a JSON body, with or without parameters on the media type', async () => {
    await expect(readJson(post('{"a":1}'))).resolves.toEqual({ a: 1 });
    await expect(readJson(post('{"a":1}', { 'content-type': 'application/json; charset=utf-8' }))).resolves.toEqual({ a: 1 });
    await expect(readJson(post('{"a":1}', { 'content-type': 'Application/JSON' }))).resolves.toEqual({ a: 1 });
  });

  it('refuses malformed JSON (400) and every other media type (415), without a 500', async () => {
    await expect(readJson(post('{"a":'))).rejects.toMatchObject({ status: 400 });
    await expect(readJson(post(''))).rejects.toMatchObject({ status: 400 });
    // Browsers send these from another site's page without a preflight.
    for (const type of [
      'text/plain',
      'text/plain; application/json',
      'application/x-www-form-urlencoded',
      'multipart/form-data; boundary=x',
      'application/jsonp',
      'application/vnd.api+json',
      '',
    ]) {
      await expect(readJson(post('{"a":1}', { 'content-type': type })), type).rejects.toMatchObject({ status: 415 });
    }
  });

  it('refuses a body over 64 KB with 413: at once when declared, as soon as the count passes the limit when streamed', async () => {
    const exactly = '"' + 'x'.repeat(JSON_BODY_LIMIT - 2) + '"';
    await expect(readJson(post(exactly))).resolves.toHaveLength(JSON_BODY_LIMIT - 2);
    await expect(readJson(post(exactly + ' '))).rejects.toMatchObject({ status: 413, message: 'The request body is larger than 64 KB.' });
    const declared = post('{}', { 'content-type': 'application/json', 'content-length': String(10 * 1024 * 1024) });
    await expect(readJson(declared)).rejects.toMatchObject({ status: 413 });
    const { stream, pulled } = streamed(10 * 1024 * 1024);
    await expect(readJson(post(stream))).rejects.toMatchObject({ status: 413 });
    // Two 64 KB chunks were read (the second passed the limit), not 10 MB.
    expect(pulled.bytes).toBeLessThanOrEqual(3 * 64 * 1024);
  });
});

describe('readBodyBytes', () => {
  it('answers null without a body and the bytes within the limit', async () => {
    expect(await readBodyBytes(new Request('http://x/', { method: 'POST' }), 10)).toBeNull();
    expect(Array.from((await readBodyBytes(post('abc', {}), 3)) ?? [])).toEqual([97, 98, 99]);
    await expect(readBodyBytes(post('abcd', {}), 3, 'Too big.')).rejects.toMatchObject({ status: 413, message: 'Too big.' });
  });
});

describe('isJsonMediaType', () => {
  it('takes the media type before any parameter', () => {
    expect(isJsonMediaType('application/json;charset=UTF-8')).toBe(true);
    expect(isJsonMediaType(' application/json ')).toBe(true);
    expect(isJsonMediaType('text/plain; application/json')).toBe(false);
    expect(isJsonMediaType(null)).toBe(false);
  });
});
