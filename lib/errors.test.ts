import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { AppError, errorResponse, isDatabaseDown, parseOrThrow, readJson } from './errors';

describe('errors', () => {
  it('maps each error type to its status', async () => {
    expect(new AppError('unauthorized').status).toBe(401);
    expect(new AppError('forbidden').status).toBe(403);
    expect(new AppError('unprocessable').status).toBe(422);
    const response = new AppError('not_found', 'No such product.').toResponse();
    expect(response.status).toBe(404);
    expect(await response.json()).toEqual({ error: 'not_found', message: 'No such product.' });
  });

  it('names each wrong field in a 400', () => {
    const schema = z.object({ altitudeFt: z.number().nonnegative(), jar: z.string() });
    try {
      parseOrThrow(schema, { altitudeFt: -5 });
      expect.unreachable();
    } catch (error) {
      const e = error as AppError;
      expect(e.status).toBe(400);
      expect(Object.keys(e.fields ?? {}).sort()).toEqual(['altitudeFt', 'jar']);
      expect(e.message).toMatch(/altitudeFt/);
    }
  });

  it('answers 503 for a database that is down and 500 without details for a bug', async () => {
    const down = Object.assign(new Error('connect ECONNREFUSED'), { name: 'SequelizeConnectionRefusedError' });
    expect(isDatabaseDown(down)).toBe(true);
    expect(errorResponse(down).status).toBe(503);
    const bug = errorResponse(new TypeError('x is undefined'));
    expect(bug.status).toBe(500);
    expect(JSON.stringify(await bug.json())).not.toMatch(/undefined|TypeError|at /);
  });

  it('refuses malformed JSON and the wrong content type without throwing a 500', async () => {
    const bad = new Request('http://x/', { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{"a":' });
    await expect(readJson(bad)).rejects.toMatchObject({ status: 400 });
    const text = new Request('http://x/', { method: 'POST', headers: { 'content-type': 'text/plain' }, body: 'hi' });
    await expect(readJson(text)).rejects.toMatchObject({ status: 415 });
  });
});
