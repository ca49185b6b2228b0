import { boilingPoint } from '@/lib/preserving';
import { toolRoute, withAltitude } from '@/lib/preserving/http';

const query = withAltitude({});

/** GET /api/tools/boiling-point?altitudeFt (or altitudeM) — boiling point of water (1976 atmosphere + IAPWS-IF97). */
export const GET = toolRoute(query, boilingPoint);
