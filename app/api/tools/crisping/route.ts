import { crispingPlan } from '@/lib/preserving';
import { toolRoute } from '@/lib/preserving/http';
import { toolQueries } from '@/lib/validations/tools';

/** GET /api/tools/crisping?agent&jar&jars — calcium chloride doses or the pickling-lime schedule. */
export const GET = toolRoute(toolQueries.crisping, crispingPlan);
