import { z } from 'zod';
import { AppError, parseOrThrow, route } from '@/lib/errors';
import { PreservingError, RULES, checkChoice, parseNumber, type NumberRule } from './errors';
import { altitudeInFeet } from './units';

/**
 * Query-string schemas and the error mapping for the /api/tools/* routes. Server-side only by use
 * (it is not re-exported from index.ts, so calculator components never pull zod in).
 */

/** A numeric query parameter, parsed with the same rule (and message) the components use. */
export function numberParam(rule: NumberRule) {
  return numeric(rule, false) as z.ZodType<number, string | null | undefined>;
}

/** An optional numeric query parameter: absent or empty means "not given". */
export function optionalNumberParam(rule: NumberRule) {
  return numeric(rule, true);
}

function numeric(rule: NumberRule, optional: boolean) {
  return z
    .string()
    .nullish()
    .transform((raw, ctx): number | undefined => {
      if (optional && (raw === undefined || raw === null || raw.trim() === '')) return undefined;
      try {
        return parseNumber(raw, rule);
      } catch (error) {
        ctx.addIssue({ code: 'custom', message: (error as Error).message });
        return z.NEVER;
      }
    });
}

/** A query parameter from a fixed list. */
export function choiceParam<T extends string>(choices: readonly T[], param: string, label: string) {
  return z
    .string()
    .nullish()
    .transform((raw, ctx) => {
      try {
        return checkChoice(raw, choices, param, label);
      } catch (error) {
        ctx.addIssue({ code: 'custom', message: (error as Error).message });
        return z.NEVER;
      }
    });
}

/**
 * The altitude of a query: `altitudeFt`, or `altitudeM` for metres (exactly one of them), read into
 * feet. Both or neither is a 400 naming them.
 */
export function withAltitude<S extends z.ZodRawShape>(shape: S) {
  return z.object({ ...shape, altitudeFt: optionalNumberParam(RULES.altitudeFt), altitudeM: optionalNumberParam(RULES.altitudeM) }).transform((query, ctx) => {
    const { altitudeFt, altitudeM, ...rest } = query as { altitudeFt?: number; altitudeM?: number } & Record<string, unknown>;
    if ((altitudeFt === undefined) === (altitudeM === undefined)) {
      // Neither: the same sentence as a missing feet value; both: refused rather than one silently winning.
      const message =
        altitudeFt === undefined ? `Enter ${RULES.altitudeFt.label} as a number.` : 'Give the altitude once: altitudeFt in feet, or altitudeM in metres.';
      ctx.addIssue({ code: 'custom', path: ['altitudeFt'], message });
      return z.NEVER;
    }
    return { ...(rest as z.infer<z.ZodObject<S>>), altitudeFt: altitudeFt ?? altitudeInFeet(altitudeM as number, 'm') };
  });
}

/** A product id: must be given (400); an unknown one is the function's 404. */
export const productParam = z.string({ error: 'Choose a product.' }).trim().min(1, 'Choose a product.');
/** An optional product id: absent or empty means "not given"; an unknown one is the function's 404. */
export const optionalProductParam = z
  .string()
  .nullish()
  .transform((raw) => (raw === undefined || raw === null || raw.trim() === '' ? undefined : raw.trim()));

/** A free-text unit name, checked by the function it is passed to. */
export const unitParam = (what: string) =>
  z
    .string({ error: `Choose ${what}.` })
    .trim()
    .min(1, `Choose ${what}.`);

/** Turns a PreservingError into the API's answer: 400 naming the field, 404, or 422. */
export function toAppError(error: PreservingError): AppError {
  const extra = error.param ? { param: error.param } : undefined;
  if (error.kind === 'invalid') {
    // Same shape as a zod failure: the message names the parameter, `fields` carries the sentence.
    const param = error.param ?? 'query';
    return new AppError('bad_request', `Please check the query: ${param} (${error.message}).`, { fields: { [param]: [error.message] } });
  }
  if (error.kind === 'not-found') return new AppError('not_found', error.message, { extra });
  return new AppError('unprocessable', error.message, { extra });
}

/**
 * One GET handler for a calculator: parse the query with zod (400 with every wrong parameter named),
 * run the pure function, answer JSON. Public: these tools need no sign-in.
 */
export function toolRoute<S extends z.ZodType>(schema: S, compute: (input: z.infer<S>) => object) {
  return route(async (request: Request) => {
    const query = Object.fromEntries(new URL(request.url).searchParams);
    const input = parseOrThrow(schema, query, 'query');
    try {
      return Response.json(compute(input), { headers: { 'Cache-Control': 'public, max-age=3600' } });
    } catch (error) {
      if (error instanceof PreservingError) throw toAppError(error);
      throw error;
    }
  });
}
