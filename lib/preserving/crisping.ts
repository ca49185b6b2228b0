import { JARS_RULE, checkChoice, checkNumber, outsideTable } from './errors';
import { JAR_SIZES, type JarSize } from './products';
import { JAR_PINTS } from './units';

export const CRISPING_AGENTS = ['calcium-chloride', 'pickling-lime'] as const;
export type CrispingAgent = (typeof CRISPING_AGENTS)[number];

/** Calcium chloride granules added to each jar: a rounded 1/8 tsp per pint, 1/4 tsp per quart
 * (manufacturer's label directions as quoted in extension material; secondary source). */
export const CALCIUM_CHLORIDE_TSP: Partial<Record<JarSize, number>> = { pint: 0.125, quart: 0.25 };

/** Pickling lime soak: 1 cup food-grade pickling lime per gallon of water, 12–24 hours, then rinse
 * and resoak 1 hour in fresh cold water three times in all (USDA Complete Guide to Home Canning,
 * rev. 2015, Guide 6, "Bread-and-butter pickles", variation for firmer pickles; about 8 pints of
 * slices per gallon of soak). */
export const LIME = { cupsPerGallon: 1, pintsPerGallon: 8, soakHours: [12, 24] as [number, number], rinses: 3 };

const COMMON_CAUTION = "A crisping agent only firms texture: it does not replace the tested recipe's vinegar, salt or processing time.";

export type CalciumChloridePlan = { agent: 'calcium-chloride'; perJarTsp: number; totalTsp: number; source: string; cautions: string[] };
export type LimePlan = { agent: 'pickling-lime'; limeCups: number; waterGallons: number; soakHours: [number, number]; rinses: number; source: string; cautions: string[] };
export type CrispingPlan = CalciumChloridePlan | LimePlan;

/** Dose per jar and per batch (calcium chloride), or the soak and rinse schedule (pickling lime). */
export function crispingPlan({ agent, jar, jars }: { agent: CrispingAgent | string; jar: JarSize | string; jars: number }): CrispingPlan {
  const kind = checkChoice(agent, CRISPING_AGENTS, 'agent', 'a crisping agent');
  const size = checkChoice(jar, JAR_SIZES, 'jar', 'a jar size');
  const count = checkNumber(jars, JARS_RULE);
  if (kind === 'calcium-chloride') {
    const perJarTsp = CALCIUM_CHLORIDE_TSP[size];
    if (perJarTsp === undefined) throw outsideTable('The calcium chloride directions give a dose for pint and quart jars only, not half-pints.', 'jar');
    return {
      agent: kind,
      perJarTsp,
      totalTsp: perJarTsp * count,
      source: 'Calcium chloride label directions (rounded 1/8 tsp per pint, 1/4 tsp per quart), as quoted in extension material',
      cautions: [
        'Add the granules to each filled jar before the lid goes on; do not add them to a fermenting crock.',
        'Calcium chloride does not change the acidity of the brine (Iowa State University Extension).',
        COMMON_CAUTION,
      ],
    };
  }
  const pints = count * JAR_PINTS[size];
  // Whole half-gallons of soak, at least the tested recipe's one gallon.
  const waterGallons = Math.max(1, Math.ceil((pints / LIME.pintsPerGallon) * 2) / 2);
  return {
    agent: kind,
    limeCups: waterGallons * LIME.cupsPerGallon,
    waterGallons,
    soakHours: LIME.soakHours,
    rinses: LIME.rinses,
    source: 'USDA Complete Guide to Home Canning (rev. 2015), Guide 6, bread-and-butter pickles, variation for firmer pickles',
    cautions: [
      'Use food-grade pickling lime only, in a glass, stoneware or food-grade plastic container; avoid breathing the dust while mixing, and keep it off skin and out of eyes.',
      'Rinse and resoak in fresh cold water three times: lime left on the produce lowers its acidity, and too little acid makes the pickles unsafe.',
      COMMON_CAUTION,
    ],
  };
}
