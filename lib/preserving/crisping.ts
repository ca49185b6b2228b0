import { JARS_RULE, checkChoice, checkNumber, outsideTable } from './errors';
import { JAR_SIZES, PRODUCTS, type JarSize } from './products';
import { JAR_PINTS } from './units';

export const CRISPING_AGENTS = ['calcium-chloride', 'pickling-lime'] as const;
export type CrispingAgent = (typeof CRISPING_AGENTS)[number];

/** Calcium chloride granules added to each jar: a rounded 1/8 tsp per pint, 1/4 tsp per quart
 * (manufacturer's label directions as quoted in extension material; secondary source). */
export const CALCIUM_CHLORIDE_TSP: Partial<Record<JarSize, number>> = { pint: 0.125, quart: 0.25 };

/** Pickling lime belongs to one tested recipe: the bread-and-butter pickles' variation for firmer
 * pickles mixes 1 cup pickling lime and 1/2 cup salt into 1 gallon of water in a 2- to 3-gallon crock
 * or enamelware container, soaks the slices of the whole recipe (6 lb cucumbers, about 8 pints)
 * 12–24 hours, then rinses and resoaks them 1 hour in fresh cold water three times in all (USDA
 * Complete Guide to Home Canning, rev. 2015, Guide 6, "Bread-and-butter pickles"; read in the
 * Michigan State University Extension reproduction of Guide 6:19). */
export const LIME = {
  recipe: 'bread-and-butter-pickles' as const,
  cupsPerGallon: 1,
  saltCupsPerGallon: 0.5,
  pintsPerGallon: 8,
  soakHours: [12, 24] as [number, number],
  rinses: 3,
};
export const LIME_SOURCE =
  'USDA Complete Guide to Home Canning (rev. 2015), Guide 6, "Bread-and-butter pickles", variation for firmer pickles (1 cup pickling lime and 1/2 cup salt per gallon of water, for the recipe\'s 6 lb of cucumbers, about 8 pints)';
/** Calcium chloride label directions, as quoted in extension material (secondary source). */
export const CALCIUM_CHLORIDE_SOURCE =
  'Calcium chloride label directions (rounded 1/8 tsp per pint, 1/4 tsp per quart), as quoted in extension material (secondary source)';

const COMMON_CAUTION = "A crisping agent only firms texture: it does not replace the tested recipe's vinegar, salt or processing time.";

export type CalciumChloridePlan = { agent: 'calcium-chloride'; perJarTsp: number; totalTsp: number; source: string; cautions: string[] };
export type LimePlan = {
  agent: 'pickling-lime';
  /** The one tested recipe the lime soak belongs to. */
  recipe: typeof LIME.recipe;
  recipeName: string;
  /** Whole recipes of lime water: one gallon for each 6 lb of cucumbers (about 8 pints). */
  recipes: number;
  limeCups: number;
  saltCups: number;
  waterGallons: number;
  soakHours: [number, number];
  rinses: number;
  source: string;
  cautions: string[];
};
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
      source: CALCIUM_CHLORIDE_SOURCE,
      cautions: [
        'Add the granules to each filled jar before the lid goes on; do not add them to a fermenting crock.',
        'Calcium chloride does not change the acidity of the brine (Iowa State University Extension).',
        COMMON_CAUTION,
      ],
    };
  }
  const recipe = PRODUCTS[LIME.recipe];
  if (!recipe.jars.includes(size)) {
    throw outsideTable(
      `Pickling lime belongs to one tested recipe, ${recipe.name.toLowerCase()}, which is canned in ${recipe.jars.join(' and ')} jars only, not ${size} jars.`,
      'jar',
    );
  }
  const pints = count * JAR_PINTS[size];
  // One gallon of lime water per whole recipe (6 lb cucumbers, about 8 pints): the guide gives no other amount.
  const recipes = Math.ceil(pints / LIME.pintsPerGallon - 1e-9);
  return {
    agent: kind,
    recipe: LIME.recipe,
    recipeName: recipe.name,
    recipes,
    limeCups: recipes * LIME.cupsPerGallon,
    saltCups: recipes * LIME.saltCupsPerGallon,
    waterGallons: recipes,
    soakHours: LIME.soakHours,
    rinses: LIME.rinses,
    source: LIME_SOURCE,
    cautions: [
      'Mix each gallon in a 2- to 3-gallon crock or enamelware container; use food-grade pickling lime only, avoid breathing the dust while mixing, and keep it off skin and out of eyes.',
      'Rinse and resoak in fresh cold water three times: lime left on the produce lowers its acidity, and too little acid makes the pickles unsafe.',
      `This soak is for ${recipe.name.toLowerCase()} only; then follow that recipe's liquid and processing time.`,
      COMMON_CAUTION,
    ],
  };
}
