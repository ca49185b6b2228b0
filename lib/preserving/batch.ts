import { JARS_RULE, checkChoice, checkNumber, outsideTable } from './errors';
import { JAR_SIZES, MAX_TABLE_ALTITUDE_FT, PRODUCTS, getProduct, type JarSize, type ProductId } from './products';
import { STERILIZE_BELOW_MINUTES, STERILIZE_SOURCE, sterilizingMinutes } from './processing';
import { JAR_PINTS, convert, mlPer } from './units';

type IngredientUnit = 'lb' | 'cup' | 'tbsp' | 'tsp' | 'gallon' | 'head' | 'clove' | 'stick' | 'whole';
type Ingredient = { name: string; amount: number; unit: IngredientUnit; brine?: boolean };
type Recipe = { yieldPints: number; produceLb: number | null; ingredients: Ingredient[]; source: string };

const G6 = 'USDA Complete Guide to Home Canning (AIB 539, rev. 2015), Guide 6';

/** The tested recipes the planner scales, with their published yields. `brine: true` marks the
 * liquids that are poured over the produce in the jars. */
export const RECIPES: Record<ProductId, Recipe> = {
  'fresh-pack-dill-pickles': {
    yieldPints: 9,
    produceLb: 8,
    source: `${G6}, "Quick fresh-pack dill pickles" (8 lb cucumbers, 7–9 pints; 1 tsp mustard seed per pint sets 9)`,
    ingredients: [
      { name: 'pickling cucumbers, 3 to 5 inch', amount: 8, unit: 'lb' },
      { name: 'canning or pickling salt, for the 12-hour pre-brine', amount: 0.75, unit: 'cup' },
      { name: 'water, for the 12-hour pre-brine', amount: 2, unit: 'gallon' },
      { name: 'vinegar (5% acidity)', amount: 6, unit: 'cup', brine: true },
      { name: 'water', amount: 8, unit: 'cup', brine: true },
      { name: 'canning or pickling salt, for the pickling liquid', amount: 0.5, unit: 'cup' },
      { name: 'sugar', amount: 0.25, unit: 'cup' },
      { name: 'whole mixed pickling spice', amount: 2, unit: 'tbsp' },
      { name: 'whole mustard seed', amount: 3, unit: 'tbsp' },
      { name: 'fresh dill', amount: 14, unit: 'head' },
    ],
  },
  'bread-and-butter-pickles': {
    yieldPints: 8,
    produceLb: 6,
    source: `${G6}, "Bread-and-butter pickles" (6 lb cucumbers, about 8 pints)`,
    ingredients: [
      { name: 'pickling cucumbers, 4 to 5 inch', amount: 6, unit: 'lb' },
      { name: 'thinly sliced onions (about 3 lb)', amount: 8, unit: 'cup' },
      { name: 'canning or pickling salt', amount: 0.5, unit: 'cup' },
      { name: 'vinegar (5% acidity)', amount: 4, unit: 'cup', brine: true },
      { name: 'sugar', amount: 4.5, unit: 'cup' },
      { name: 'mustard seed', amount: 2, unit: 'tbsp' },
      { name: 'celery seed', amount: 1.5, unit: 'tbsp' },
      { name: 'ground turmeric', amount: 1, unit: 'tbsp' },
    ],
  },
  'pickle-relish': {
    yieldPints: 9,
    produceLb: null,
    source: `${G6}, "Pickle relish" (measured by volume, about 9 pints)`,
    ingredients: [
      { name: 'chopped cucumbers', amount: 12, unit: 'cup' },
      { name: 'chopped sweet green peppers', amount: 3, unit: 'cup' },
      { name: 'chopped sweet red peppers', amount: 3, unit: 'cup' },
      { name: 'chopped onions', amount: 1, unit: 'cup' },
      { name: 'canning or pickling salt', amount: 0.75, unit: 'cup' },
      { name: 'ice, for the 4-hour soak', amount: 4, unit: 'cup' },
      { name: 'water, for the 4-hour soak', amount: 8, unit: 'cup' },
      { name: 'sugar', amount: 2, unit: 'cup' },
      { name: 'each of mustard seed, turmeric, whole allspice and whole cloves', amount: 4, unit: 'tsp' },
      { name: 'white vinegar (5% acidity)', amount: 6, unit: 'cup', brine: true },
    ],
  },
  'dilly-beans': {
    yieldPints: 4,
    produceLb: 2,
    source:
      'University of Georgia Extension, So Easy to Preserve, 6th edition (2014), "Pickled dilly beans" (2 lb beans, 4 pints), as reproduced by University of Minnesota Extension',
    ingredients: [
      { name: 'green or yellow beans, 5 to 6 inch', amount: 2, unit: 'lb' },
      { name: 'water', amount: 2.5, unit: 'cup', brine: true },
      { name: 'white vinegar (5% acidity)', amount: 2.5, unit: 'cup', brine: true },
      { name: 'canning or pickling salt', amount: 0.25, unit: 'cup' },
      { name: 'cayenne pepper or red pepper flakes (1/4 tsp per pint)', amount: 1, unit: 'tsp' },
      { name: 'dill (1 head or 1 tsp seed per pint)', amount: 4, unit: 'head' },
      { name: 'garlic (1 clove per pint)', amount: 4, unit: 'clove' },
    ],
  },
  'pickled-beets': {
    yieldPints: 8,
    produceLb: 7,
    source: `${G6}, "Pickled beets" (7 lb beets, about 8 pints)`,
    ingredients: [
      { name: 'beets, 2 to 2 1/2 inch across', amount: 7, unit: 'lb' },
      { name: 'vinegar (5% acidity)', amount: 4, unit: 'cup', brine: true },
      { name: 'water', amount: 2, unit: 'cup', brine: true },
      { name: 'sugar', amount: 2, unit: 'cup' },
      { name: 'canning or pickling salt', amount: 1.5, unit: 'tsp' },
      { name: 'cinnamon sticks', amount: 2, unit: 'stick' },
      { name: 'whole cloves', amount: 12, unit: 'whole' },
    ],
  },
  'pickled-hot-peppers': {
    yieldPints: 9,
    produceLb: 7,
    source: `${G6}, "Pickled hot peppers" (4 lb hot and 3 lb sweet peppers, about 9 pints)`,
    ingredients: [
      { name: 'hot long red, green or yellow peppers', amount: 4, unit: 'lb' },
      { name: 'sweet red and green peppers, mixed', amount: 3, unit: 'lb' },
      { name: 'vinegar (5% acidity)', amount: 5, unit: 'cup', brine: true },
      { name: 'water', amount: 1, unit: 'cup', brine: true },
      { name: 'canning or pickling salt', amount: 4, unit: 'tsp' },
      { name: 'sugar', amount: 2, unit: 'tbsp' },
      { name: 'garlic', amount: 2, unit: 'clove' },
    ],
  },
  'fermented-dill-pickles': {
    // The guide gives quantities per gallon of crock; 4 lb of cucumbers at the guide's average of
    // 2 lb per quart ("Selection of fresh cucumbers") fills about 2 quarts (4 pints).
    yieldPints: 4,
    produceLb: 4,
    source: `${G6}, "Dill pickles" (per gallon of crock: 4 lb cucumbers); yield from the guide's 2 lb of cucumbers per quart`,
    ingredients: [
      { name: 'pickling cucumbers, 4 inch', amount: 4, unit: 'lb' },
      { name: 'dill seed (or 4 to 5 heads fresh dill)', amount: 2, unit: 'tbsp' },
      { name: 'canning or pickling salt', amount: 0.5, unit: 'cup' },
      { name: 'vinegar (5% acidity)', amount: 0.25, unit: 'cup', brine: true },
      { name: 'water', amount: 8, unit: 'cup', brine: true },
      { name: 'garlic (optional)', amount: 2, unit: 'clove' },
      { name: 'whole mixed pickling spice (optional)', amount: 2, unit: 'tsp' },
    ],
  },
};

/** Extra brine on top of the scaled recipe, for spills and topping up jars (common practice). */
export const EXTRA_BRINE_PCT = 10;

const COUNTED: IngredientUnit[] = ['head', 'clove', 'stick', 'whole'];
const round2 = (n: number) => Math.round(n * 100) / 100;

export type PlannedIngredient = { name: string; amount: number; unit: IngredientUnit; metric?: { amount: number; unit: 'kg' | 'mL' | 'L' } };
export type BatchPlan = {
  produceLb: number | null;
  produceKg: number | null;
  brineMl: number;
  extraPct: number;
  ingredients: PlannedIngredient[];
  scale: number;
  source: string;
  /** Where the jar size's process is under 10 minutes (some altitude bands): the jars must be sterilised. */
  sterilizeJars?: { message: string; source: string };
};

/** Produce, brine and the other ingredients for N jars, scaled from the tested recipe's yield. */
export function planBatch({ product, jar, jars }: { product: string; jar: JarSize | string; jars: number }): BatchPlan {
  const found = getProduct(product);
  const size = checkChoice(jar, JAR_SIZES, 'jar', 'a jar size');
  const count = checkNumber(jars, JARS_RULE);
  if (!found.jars.includes(size)) {
    throw outsideTable(`The tested recipe for ${found.name.toLowerCase()} is processed in ${found.jars.join(' and ')} jars only, not ${size} jars.`, 'jar');
  }
  const recipe = RECIPES[found.id];
  const scale = (count * JAR_PINTS[size]) / recipe.yieldPints;
  const brineCups = recipe.ingredients.filter((i) => i.brine).reduce((sum, i) => sum + i.amount, 0);
  const ingredients = recipe.ingredients.map(({ name, amount, unit }): PlannedIngredient => {
    const scaled = amount * scale;
    if (COUNTED.includes(unit)) return { name, amount: Math.ceil(scaled - 1e-9), unit };
    if (unit === 'lb') return { name, amount: round2(scaled), unit, metric: { amount: round2(convert(scaled, 'lb', 'kg')), unit: 'kg' } };
    const ml = scaled * mlPer(unit as 'cup' | 'tbsp' | 'tsp' | 'gallon');
    return { name, amount: round2(scaled), unit, metric: ml >= 1000 ? { amount: round2(ml / 1000), unit: 'L' } : { amount: Math.round(ml), unit: 'mL' } };
  });
  const produceLb = recipe.produceLb === null ? null : recipe.produceLb * scale;
  return {
    produceLb: produceLb === null ? null : round2(produceLb),
    produceKg: produceLb === null ? null : round2(convert(produceLb, 'lb', 'kg')),
    brineMl: Math.round(brineCups * mlPer('cup') * scale * (1 + EXTRA_BRINE_PCT / 100)),
    extraPct: EXTRA_BRINE_PCT,
    ingredients,
    scale,
    source: recipe.source,
    ...sterilizeNote(found.id, size),
  };
}

/** The sterilising step where any altitude band of the jar size's table processes under 10 minutes. */
function sterilizeNote(id: ProductId, size: JarSize): Pick<BatchPlan, 'sterilizeJars'> {
  const product = PRODUCTS[id];
  const row = product.times[size] ?? [];
  const short = product.bands.map((band, i) => ({ band, minutes: row[i] })).filter((b) => b.minutes < STERILIZE_BELOW_MINUTES);
  if (!short.length) return {};
  const where = short
    .map(
      ({ band, minutes }) =>
        `${minutes} minutes at ${band.fromFt === 0 ? 'up to' : `${band.fromFt.toLocaleString('en-US')} to`} ${(band.toFt ?? MAX_TABLE_ALTITUDE_FT).toLocaleString('en-US')} ft`,
    )
    .join(', ');
  return {
    sterilizeJars: {
      message: `${product.name} in ${size} jars are processed ${where}, under ${STERILIZE_BELOW_MINUTES} minutes: there, the jars must be sterilised before filling (boil the empty jars ${sterilizingMinutes(0)} minutes up to 1,000 ft, 1 more minute for each further 1,000 ft).`,
      source: STERILIZE_SOURCE,
    },
  };
}
