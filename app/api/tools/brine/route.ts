import { z } from 'zod';
import { RULES, brineAcidity } from '@/lib/preserving';
import { numberParam, optionalNumberParam, optionalProductParam, toolRoute } from '@/lib/preserving/http';

const query = z.object({
  vinegarMl: numberParam(RULES.vinegarMl),
  vinegarAcidityPct: numberParam(RULES.vinegarAcidityPct),
  waterMl: numberParam(RULES.waterMl),
  otherMl: optionalNumberParam(RULES.otherMl),
  produceG: optionalNumberParam(RULES.produceG),
  produceWaterPct: optionalNumberParam(RULES.produceWaterPct),
  product: optionalProductParam,
});

/** GET /api/tools/brine[?product] — acetic acid %, comparison with the tested liquid, the liquid's pH before the produce, and warnings. */
export const GET = toolRoute(query, brineAcidity);
