import { ZodError, type z } from 'zod';
import { getEnv } from '@/lib/env';
import { CROSS_SITE_MESSAGE, isCrossSite } from '@/lib/server/same-origin';

export type ErrorType =
  'bad_request' | 'unauthorized' | 'forbidden' | 'not_found' | 'conflict' | 'unprocessable' | 'rate_limit' | 'too_large' | 'unsupported_media' | 'unavailable';

const STATUS: Record<ErrorType, number> = {
  bad_request: 400,
  unauthorized: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  too_large: 413,
  unsupported_media: 415,
  unprocessable: 422,
  rate_limit: 429,
  unavailable: 503,
};

const DEFAULT_MESSAGE: Record<ErrorType, string> = {
  bad_request: 'The request is not valid.',
  unauthorized: 'Please sign in first.',
  forbidden: 'Your account does not have access to this.',
  not_found: 'Nothing was found here.',
  conflict: 'That conflicts with something that already exists.',
  too_large: 'That is too large.',
  unsupported_media: 'That kind of file is not accepted.',
  unprocessable: 'That request cannot be answered.',
  rate_limit: 'Too many attempts. Please wait and try again.',
  unavailable: 'Brinewright cannot reach its database right now. Please try again in a moment.',
};

/** The one error type that route handlers and actions throw; it knows its HTTP answer. */
export class AppError extends Error {
  readonly type: ErrorType;
  readonly fields?: Record<string, string[]>;
  readonly extra?: Record<string, unknown>;

  constructor(type: ErrorType, message?: string, options: { fields?: Record<string, string[]>; extra?: Record<string, unknown> } = {}) {
    super(message ?? DEFAULT_MESSAGE[type]);
    this.name = 'AppError';
    this.type = type;
    this.fields = options.fields;
    this.extra = options.extra;
  }

  get status(): number {
    return STATUS[this.type];
  }

  toJSON() {
    // The last guard against a message that quotes a huge input.
    return {
      error: this.type,
      message: this.message.length > 600 ? clipText(this.message, 600) : this.message,
      ...(this.fields ? { fields: this.fields } : {}),
      ...(this.extra ?? {}),
    };
  }

  toResponse(init: ResponseInit = {}): Response {
    return Response.json(this.toJSON(), { ...init, status: this.status });
  }
}

/**
 * Text that may echo the user's input, made fit for a message: control and format characters and
 * lone surrogates become "�", and anything beyond `max` characters ends in "…".
 */
export function clipText(text: string, max = 120): string {
  const clean = text.replace(/[\p{Cc}\p{Cs}\p{Cf}]/gu, '\uFFFD');
  const chars = Array.from(clean);
  return chars.length > max ? chars.slice(0, max - 1).join('') + '…' : clean;
}

/** Field name → messages, from a zod error; the root of the input is called "body". */
export function fieldErrors(error: ZodError): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  // Names and messages can quote the input (unknown keys, record keys): kept short and printable.
  for (const issue of error.issues.slice(0, 50)) {
    const key = issue.path.length ? clipText(issue.path.map(String).join('.'), 80) : 'body';
    (fields[key] ??= []).push(clipText(issue.message, 200));
  }
  return fields;
}

export function validationError(error: ZodError, what = 'input'): AppError {
  const fields = fieldErrors(error);
  const names = Object.keys(fields);
  return new AppError('bad_request', `Please check the ${what}: ${names.map((n) => `${n} (${fields[n][0]})`).join('; ')}.`, { fields });
}

/** Parses with a schema or throws a 400 AppError naming every wrong field. */
export function parseOrThrow<S extends z.ZodType>(schema: S, value: unknown, what?: string): z.infer<S> {
  const result = schema.safeParse(value);
  if (!result.success) throw validationError(result.error, what);
  return result.data;
}

/** True for errors that mean the database is unreachable rather than a bug. */
export function isDatabaseDown(error: unknown): boolean {
  const seen = new Set<unknown>();
  let current: unknown = error;
  while (current && typeof current === 'object' && !seen.has(current)) {
    seen.add(current);
    const e = current as { name?: string; code?: string; message?: string; parent?: unknown; original?: unknown; cause?: unknown };
    if (e.name && /Sequelize(Connection\w*|HostNotReachable|HostNotFound|AccessDenied|ConnectionAcquireTimeout)Error/.test(e.name)) return true;
    if (
      e.code &&
      [
        'ECONNREFUSED',
        'ECONNRESET',
        'ER_GET_CONNECTION_TIMEOUT',
        'ER_CONNECTION_TIMEOUT',
        'ER_SOCKET_UNEXPECTED_CLOSE',
        'PROTOCOL_CONNECTION_LOST',
        'ER_CLOSING_POOL',
      ].includes(e.code)
    )
      return true;
    current = e.parent ?? e.original ?? e.cause;
  }
  return false;
}

/** Turns anything thrown in a route handler into a JSON answer; never leaks a stack trace. */
export function errorResponse(error: unknown): Response {
  if (error instanceof AppError) return error.toResponse();
  if (error instanceof ZodError) return validationError(error).toResponse();
  if (isDatabaseDown(error)) return new AppError('unavailable').toResponse({ headers: { 'Retry-After': '5' } });
  console.error('[brinewright] unexpected error', error);
  return Response.json({ error: 'internal', message: 'Something went wrong on our side. Please try again.' }, { status: 500 });
}

/** Percent-decodes a path parameter once more when it can; a stray "%" (URIError) leaves it as it is. */
export function decodeParam(value: string): string {
  try {
    return decodeURIComponent(value);
  } catch {
    return value;
  }
}

type Handler<C> = (request: Request, context: C) => Promise<Response>;

/** The origins the app is served from (APP_URL, NEXTAUTH_URL), for the cross-site check. */
export function appOrigins(): string[] {
  const env = getEnv();
  return [env.APP_URL, env.NEXTAUTH_URL].filter((url): url is string => Boolean(url)).map((url) => new URL(url).origin);
}

/** Throws AppError 403 for a request from another site's page that would change something. */
export function refuseCrossSite(request: Request): void {
  if (isCrossSite(request, appOrigins)) throw new AppError('forbidden', CROSS_SITE_MESSAGE);
}

/**
 * Wraps a route handler so every thrown error gets its one JSON answer, after refusing writes sent
 * from another site's page (SameSite=Lax cookies still ride along on some of them).
 */
export function route<C = unknown>(handler: Handler<C>): Handler<C> {
  return async (request, context) => {
    try {
      refuseCrossSite(request);
      return await handler(request, context);
    } catch (error) {
      // Next's own control-flow errors (redirect, notFound) must pass through.
      if (
        error &&
        typeof error === 'object' &&
        'digest' in error &&
        typeof (error as { digest: unknown }).digest === 'string' &&
        /^NEXT_/.test((error as { digest: string }).digest)
      )
        throw error;
      return errorResponse(error);
    }
  };
}
