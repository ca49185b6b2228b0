import { z } from 'zod';
import { RULES, SALT_KINDS, saltToGrams } from '@/lib/preserving';
import { choiceParam, numberParam, optionalNumberParam, toolRoute, unitParam } from '@/lib/preserving/http';

const query = z.object({
  salt: choiceParam(SALT_KINDS, 'salt', 'a kind of salt'),
  amount: numberParam(RULES.amount),
  unit: unitParam('a unit for the salt'),
  waterMl: optionalNumberParam(RULES.waterMl),
});

/** GET /api/tools/salt?salt&amount&unit[&waterMl] — grams, brine % by weight, and suitability. */
export const GET = toolRoute(query, saltToGrams);
