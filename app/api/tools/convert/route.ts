import { z } from 'zod';
import { RULES, convert } from '@/lib/preserving';
import { numberParam, toolRoute, unitParam } from '@/lib/preserving/http';

const query = z.object({ value: numberParam(RULES.value), from: unitParam('a unit to convert from'), to: unitParam('a unit to convert to') });

/** GET /api/tools/convert?value&from&to — exact conversion between units of the same kind. */
export const GET = toolRoute(query, ({ value, from, to }) => ({ value: convert(value, from, to), from, to }));
