import { sugarToGrams } from '@/lib/preserving';
import { toolRoute } from '@/lib/preserving/http';
import { toolQueries } from '@/lib/validations/tools';

/** GET /api/tools/sugar?sugar&amount&unit[&liquidMl] — grams, and the sugar's share by weight of the syrup. */
export const GET = toolRoute(toolQueries.sugar, sugarToGrams);
