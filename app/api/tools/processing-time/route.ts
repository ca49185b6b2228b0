import { z } from 'zod';
import { JAR_SIZES, RULES, processingTime } from '@/lib/preserving';
import { choiceParam, numberParam, productParam, toolRoute } from '@/lib/preserving/http';

const query = z.object({ product: productParam, jar: choiceParam(JAR_SIZES, 'jar', 'a jar size'), altitudeFt: numberParam(RULES.altitudeFt) });

/** GET /api/tools/processing-time?product&jar&altitudeFt — boiling-water minutes from the USDA table. */
export const GET = toolRoute(query, processingTime);
