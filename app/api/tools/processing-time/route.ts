import { JAR_SIZES, processingTime } from '@/lib/preserving';
import { choiceParam, productParam, toolRoute, withAltitude } from '@/lib/preserving/http';

const query = withAltitude({ product: productParam, jar: choiceParam(JAR_SIZES, 'jar', 'a jar size') });

/** GET /api/tools/processing-time?product&jar&altitudeFt (or altitudeM) — boiling-water minutes from the USDA table. */
export const GET = toolRoute(query, processingTime);
