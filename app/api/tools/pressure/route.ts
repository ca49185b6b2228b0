import { pressureForAltitude } from '@/lib/preserving';
import { toolRoute } from '@/lib/preserving/http';
import { toolQueries } from '@/lib/validations/tools';

/** GET /api/tools/pressure?gauge&altitudeFt (or altitudeM) — pressure-canner pounds by gauge type and altitude. */
export const GET = toolRoute(toolQueries.pressure, pressureForAltitude);
