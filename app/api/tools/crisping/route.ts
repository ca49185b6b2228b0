import { z } from 'zod';
import { CRISPING_AGENTS, JAR_SIZES, RULES, crispingPlan } from '@/lib/preserving';
import { choiceParam, numberParam, toolRoute } from '@/lib/preserving/http';

const query = z.object({
  agent: choiceParam(CRISPING_AGENTS, 'agent', 'a crisping agent'),
  jar: choiceParam(JAR_SIZES, 'jar', 'a jar size'),
  jars: numberParam(RULES.jars),
});

/** GET /api/tools/crisping?agent&jar&jars — calcium chloride doses or the pickling-lime schedule. */
export const GET = toolRoute(query, crispingPlan);
