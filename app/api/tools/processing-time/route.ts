import { processingTime } from '@/lib/preserving';
import { toolRoute } from '@/lib/preserving/http';
import { toolQueries } from '@/lib/validations/tools';

/** GET /api/tools/processing-time?product&jar&altitudeFt (or altitudeM) — boiling-water minutes from the USDA table. */
export const GET = toolRoute(toolQueries['processing-time'], processingTime);
