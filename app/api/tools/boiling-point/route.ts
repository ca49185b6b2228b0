import { boilingPoint } from '@/lib/preserving';
import { toolRoute } from '@/lib/preserving/http';
import { toolQueries } from '@/lib/validations/tools';

/** GET /api/tools/boiling-point?altitudeFt (or altitudeM) — boiling point of water (1976 atmosphere + IAPWS-IF97). */
export const GET = toolRoute(toolQueries['boiling-point'], boilingPoint);
