import { z } from 'zod';
import { CRISPING_AGENTS, GAUGES, JAR_SIZES, RULES, SALT_KINDS, SUGAR_KINDS } from '@/lib/preserving';
import { choiceParam, numberParam, optionalNumberParam, optionalProductParam, productParam, unitParam, withAltitude } from '@/lib/preserving/http';

// The query of each GET /api/tools/<name> route, built from the calculators' own rules so the
// route, the component and the function give the same message.

const jar = choiceParam(JAR_SIZES, 'jar', 'a jar size');

export const toolQueries = {
  batch: z.object({ product: productParam, jar, jars: numberParam(RULES.jars) }),
  'boiling-point': withAltitude({}),
  brine: z.object({
    vinegarMl: numberParam(RULES.vinegarMl),
    vinegarAcidityPct: numberParam(RULES.vinegarAcidityPct),
    waterMl: numberParam(RULES.waterMl),
    otherMl: optionalNumberParam(RULES.otherMl),
    produceG: optionalNumberParam(RULES.produceG),
    produceWaterPct: optionalNumberParam(RULES.produceWaterPct),
    product: optionalProductParam,
  }),
  convert: z.object({ value: numberParam(RULES.value), from: unitParam('a unit to convert from'), to: unitParam('a unit to convert to') }),
  crisping: z.object({ agent: choiceParam(CRISPING_AGENTS, 'agent', 'a crisping agent'), jar, jars: numberParam(RULES.jars) }),
  headspace: z.object({ product: productParam, measuredIn: optionalNumberParam(RULES.measuredIn) }),
  pressure: withAltitude({ gauge: choiceParam(GAUGES, 'gauge', 'a gauge type') }),
  'processing-time': withAltitude({ product: productParam, jar }),
  salt: z.object({
    salt: choiceParam(SALT_KINDS, 'salt', 'a kind of salt'),
    amount: numberParam(RULES.amount),
    unit: unitParam('a unit for the salt'),
    waterMl: optionalNumberParam(RULES.waterMl),
  }),
  sugar: z.object({
    sugar: choiceParam(SUGAR_KINDS, 'sugar', 'a kind of sugar'),
    amount: numberParam(RULES.sugarAmount),
    unit: unitParam('a unit for the sugar'),
    liquidMl: optionalNumberParam(RULES.liquidMl),
  }),
};
