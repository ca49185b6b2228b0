import { z } from 'zod';
import { RULES, boilingPoint } from '@/lib/preserving';
import { numberParam, toolRoute } from '@/lib/preserving/http';

const query = z.object({ altitudeFt: numberParam(RULES.altitudeFt) });

/** GET /api/tools/boiling-point?altitudeFt — boiling point of water (1976 atmosphere + IAPWS-IF97). */
export const GET = toolRoute(query, boilingPoint);
