import { GAUGES, pressureForAltitude } from '@/lib/preserving';
import { choiceParam, toolRoute, withAltitude } from '@/lib/preserving/http';

const query = withAltitude({ gauge: choiceParam(GAUGES, 'gauge', 'a gauge type') });

/** GET /api/tools/pressure?gauge&altitudeFt (or altitudeM) — pressure-canner pounds by gauge type and altitude. */
export const GET = toolRoute(query, pressureForAltitude);
