import { z } from 'zod';
import { GAUGES, RULES, pressureForAltitude } from '@/lib/preserving';
import { choiceParam, numberParam, toolRoute } from '@/lib/preserving/http';

const query = z.object({ gauge: choiceParam(GAUGES, 'gauge', 'a gauge type'), altitudeFt: numberParam(RULES.altitudeFt) });

/** GET /api/tools/pressure?gauge&altitudeFt — pressure-canner pounds by gauge type and altitude. */
export const GET = toolRoute(query, pressureForAltitude);
