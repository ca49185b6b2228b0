import { AppError } from '@/lib/errors';

// The most a route reads of a request body; a larger one is refused with 413 before it is read whole.
export const JSON_BODY_LIMIT = 64 * 1024;
export const WEBHOOK_BODY_LIMIT = 1024 * 1024;
// A holder file of at most 2 MB of text, with room for its JSON escapes.
export const IMPORT_BODY_LIMIT = 3 * 1024 * 1024;

const kb = (bytes: number) => `${Math.round(bytes / 1024).toLocaleString('en-US')} KB`;

/**
 * At most `limit` bytes of the body: a declared Content-Length above it is refused at once, and a
 * body that turns out longer is refused as soon as the count passes the limit (the rest is never
 * buffered). Null when there is no body.
 */
export async function readBodyBytes(request: Request, limit: number, message = `The request body is larger than ${kb(limit)}.`): Promise<Uint8Array | null> {
  const declared = Number(request.headers.get('content-length') ?? '');
  if (Number.isFinite(declared) && declared > limit) throw new AppError('too_large', message);
  if (!request.body) return null;
  const chunks: Uint8Array[] = [];
  let size = 0;
  const reader = request.body.getReader();
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      await reader.cancel().catch(() => undefined);
      throw new AppError('too_large', message);
    }
    chunks.push(value);
  }
  const bytes = new Uint8Array(size);
  let offset = 0;
  for (const chunk of chunks) {
    bytes.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return bytes;
}

/** The body as UTF-8 text, at most `limit` bytes ('' when there is none). */
export async function readBodyText(request: Request, limit: number, message?: string): Promise<string> {
  const bytes = await readBodyBytes(request, limit, message);
  return bytes ? new TextDecoder().decode(bytes) : '';
}

/** True when the Content-Type's media type is exactly application/json (parameters such as charset allowed). */
export function isJsonMediaType(contentType: string | null): boolean {
  return (contentType ?? '').split(';')[0].trim().toLowerCase() === 'application/json';
}

/**
 * A JSON body of at most `limit` bytes. Read only with the media type application/json (a form or
 * text/plain, which a page of another site can send without asking first, is refused with 415);
 * malformed JSON is a 400, not a 500.
 */
export async function readJson(request: Request, limit = JSON_BODY_LIMIT): Promise<unknown> {
  if (!isJsonMediaType(request.headers.get('content-type'))) {
    throw new AppError('unsupported_media', 'Send the request body as JSON (Content-Type: application/json).');
  }
  const text = await readBodyText(request, limit);
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError('bad_request', 'The request body is not valid JSON.', { fields: { body: ['not valid JSON'] } });
  }
}
