import { z } from 'zod';
import { RULES, brineAcidity } from '@/lib/preserving';
import { numberParam, optionalNumberParam, toolRoute } from '@/lib/preserving/http';

const query = z.object({
  vinegarMl: numberParam(RULES.vinegarMl),
  vinegarAcidityPct: numberParam(RULES.vinegarAcidityPct),
  waterMl: numberParam(RULES.waterMl),
  otherMl: optionalNumberParam(RULES.otherMl),
  produceG: optionalNumberParam(RULES.produceG),
  produceWaterPct: optionalNumberParam(RULES.produceWaterPct),
});

/** GET /api/tools/brine — acetic acid %, vinegar share, estimated pH and warnings of a brine. */
export const GET = toolRoute(query, brineAcidity);
