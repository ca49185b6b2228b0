import { planBatch } from '@/lib/preserving';
import { toolRoute } from '@/lib/preserving/http';
import { toolQueries } from '@/lib/validations/tools';

/** GET /api/tools/batch?product&jar&jars — produce, brine (with its extra margin) and ingredients. */
export const GET = toolRoute(toolQueries.batch, planBatch);
