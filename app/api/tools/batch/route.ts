import { z } from 'zod';
import { JAR_SIZES, RULES, planBatch } from '@/lib/preserving';
import { choiceParam, numberParam, productParam, toolRoute } from '@/lib/preserving/http';

const query = z.object({ product: productParam, jar: choiceParam(JAR_SIZES, 'jar', 'a jar size'), jars: numberParam(RULES.jars) });

/** GET /api/tools/batch?product&jar&jars — produce, brine (with its extra margin) and ingredients. */
export const GET = toolRoute(query, planBatch);
