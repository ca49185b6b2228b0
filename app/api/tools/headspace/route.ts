import { headspaceCheck } from '@/lib/preserving';
import { toolRoute } from '@/lib/preserving/http';
import { toolQueries } from '@/lib/validations/tools';

/** GET /api/tools/headspace?product[&measuredIn] — recommended headspace and a verdict. */
export const GET = toolRoute(toolQueries.headspace, headspaceCheck);
