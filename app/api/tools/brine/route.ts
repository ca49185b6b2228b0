import { brineAcidity } from '@/lib/preserving';
import { toolRoute } from '@/lib/preserving/http';
import { toolQueries } from '@/lib/validations/tools';

/** GET /api/tools/brine[?product] — acetic acid %, comparison with the tested liquid, the liquid's pH before the produce, and warnings. */
export const GET = toolRoute(toolQueries.brine, brineAcidity);
