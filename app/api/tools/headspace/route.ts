import { z } from 'zod';
import { RULES, headspaceCheck } from '@/lib/preserving';
import { optionalNumberParam, productParam, toolRoute } from '@/lib/preserving/http';

const query = z.object({ product: productParam, measuredIn: optionalNumberParam(RULES.measuredIn) });

/** GET /api/tools/headspace?product[&measuredIn] — recommended headspace and a verdict. */
export const GET = toolRoute(query, headspaceCheck);
