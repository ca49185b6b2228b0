import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { AppError, clipText, decodeParam, errorResponse, isDatabaseDown, parseOrThrow } from './errors';

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

  it('never quotes a huge or unprintable input back in full', () => {
    expect(clipText('a\u0000b\uD800c\u202Ed')).toBe('a\uFFFDb\uFFFDc\uFFFDd');
    expect(clipText('x'.repeat(500), 10)).toBe('x'.repeat(9) + '…');
    expect(Array.from(clipText('🥒'.repeat(50), 10))).toHaveLength(10);
    const huge = 'k'.repeat(100_000);
    const error = (() => {
      try {
        parseOrThrow(z.object({ a: z.string() }).strict(), { a: 'ok', [huge]: 1 });
      } catch (e) {
        return e as AppError;
      }
    })()!;
    const body = error.toJSON();
    expect(body.message.length).toBeLessThanOrEqual(600);
    expect(JSON.stringify(body).length).toBeLessThan(1_000);
    expect(new AppError('bad_request', 'y'.repeat(5_000)).toJSON().message).toHaveLength(600);
  });

  it('decodes a path parameter once more without throwing on a stray %', () => {
    expect(decodeParam('AB%2DCD')).toBe('AB-CD');
    expect(decodeParam('%')).toBe('%');
    expect(decodeParam('%E0%A4%A')).toBe('%E0%A4%A');
  });
});
