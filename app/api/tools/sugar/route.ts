import { z } from 'zod';
import { RULES, SUGAR_KINDS, sugarToGrams } from '@/lib/preserving';
import { choiceParam, numberParam, optionalNumberParam, toolRoute, unitParam } from '@/lib/preserving/http';

const query = z.object({
  sugar: choiceParam(SUGAR_KINDS, 'sugar', 'a kind of sugar'),
  amount: numberParam(RULES.sugarAmount),
  unit: unitParam('a unit for the sugar'),
  liquidMl: optionalNumberParam(RULES.liquidMl),
});

/** GET /api/tools/sugar?sugar&amount&unit[&liquidMl] — grams, and the sugar's share by weight of the syrup. */
export const GET = toolRoute(query, sugarToGrams);
