import { saltToGrams } from '@/lib/preserving';
import { toolRoute } from '@/lib/preserving/http';
import { toolQueries } from '@/lib/validations/tools';

/** GET /api/tools/salt?salt&amount&unit[&waterMl] — grams, brine % by weight, and suitability. */
export const GET = toolRoute(toolQueries.salt, saltToGrams);
