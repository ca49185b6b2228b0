import { PreservingError, checkChoice, checkNumber, RULES } from './errors';
import { PRODUCTS } from './products';
import { gramsOf, isUnit, mlPer, unitKind, type Unit } from './units';

export const SALT_KINDS = ['canning', 'table', 'kosher-flake', 'kosher-coarse', 'sea-fine'] as const;
export type SaltKind = (typeof SALT_KINDS)[number];

/** gPerTsp is the figure used for one number; gPerTspRange is what published or measured figures
 * span (shown on screen beside the result, because by spoon is approximate and by weight is exact). */
type SaltInfo = { name: string; gPerTsp: number; gPerTspRange: [number, number]; gPerTspSource: string; suitable: boolean; why: string };

/**
 * Grams per level US teaspoon. These vary by brand and by how the spoon is filled (±10 % or more):
 * weigh salt when it matters. USDA Complete Guide to Home Canning (rev. 2015), Guide 6, says to use
 * canning or pickling salt; anti-caking material in other salts may cloud the brine, and flake salt
 * varies in density so is not recommended for pickled and fermented foods.
 */
export const SALTS: Record<SaltKind, SaltInfo> = {
  canning: {
    name: 'Canning or pickling salt',
    gPerTsp: 6,
    // Low end: University of Wisconsin-Extension B2267 (quoted secondhand) equates 220 g of flake salt
    // with 1 cup of canning salt, i.e. about 4.6 g per tsp; high end: about 6 g per tsp, as fine table salt.
    gPerTspRange: [4.6, 6],
    gPerTspSource:
      'no published figure found: 4.6 g (University of Wisconsin-Extension B2267, 220 g per cup, quoted secondhand) to about 6 g per teaspoon (as fine table salt, from memory); weigh it',
    suitable: true,
    why: 'Canning or pickling salt is pure salt with no anti-caking agent or iodine: it is what tested pickle recipes are measured with.',
  },
  table: {
    name: 'Table salt (iodized or with anti-caking agent)',
    gPerTsp: 6,
    gPerTspRange: [6, 6],
    gPerTspSource: 'USDA FoodData Central SR Legacy, "Salt, table", 1 tsp = 6.0 g (from memory; 6 g per tsp also on secondary pages)',
    suitable: false,
    why: 'Not recommended for pickling: its anti-caking agents can make the brine cloudy and iodine can darken pickles. Use canning or pickling salt.',
  },
  'kosher-flake': {
    name: 'Kosher salt, light hollow flakes',
    gPerTsp: 2.8,
    gPerTspRange: [2.7, 3.3],
    gPerTspSource: 'package label, 1/4 tsp = 0.7 g (from memory; unconfirmed); secondary pages give 8 to 10 g per tablespoon',
    suitable: false,
    why: 'Flake salt varies in density, so a spoonful does not hold a reliable amount: USDA does not recommend it for pickling. If you must use it, weigh it.',
  },
  'kosher-coarse': {
    name: 'Kosher salt, dense rolled flakes',
    gPerTsp: 4.8,
    gPerTspRange: [4.2, 5.3],
    gPerTspSource: 'package label, 1/4 tsp = 1.2 g (from memory; unconfirmed); secondary pages give 12.5 to 16 g per tablespoon',
    suitable: false,
    why: 'Flake salt varies in density, so a spoonful does not hold a reliable amount: USDA does not recommend it for pickling. If you must use it, weigh it.',
  },
  'sea-fine': {
    name: 'Fine sea salt',
    gPerTsp: 5.6,
    // No published figure found; the span of fine salts above is used (unconfirmed).
    gPerTspRange: [4.6, 6],
    gPerTspSource: 'no published figure found: about 5.6 g per teaspoon from memory, shown with the span of fine salts (4.6 to 6 g); weigh it',
    suitable: false,
    why: 'Not the salt tested recipes are measured with: minerals or anti-caking agents in sea salt can cloud the brine or discolor pickles (common practice). Use canning or pickling salt.',
  },
};

/** Water's mass per millilitre taken as 1 g (it is 0.998 g at 20 °C; the difference is 0.2 %). */
const WATER_G_PER_ML = 1;

export type SaltToGramsInput = { salt: SaltKind | string; amount: number; unit: Unit | string; waterMl?: number };
export type SaltToGramsResult = {
  grams: number;
  /** By spoon or cup: the grams the published or measured figures span. By weight: [grams, grams]. */
  gramsRange: [number, number];
  /** True when the amount was given by weight (exact); false by spoon or cup (approximate). */
  byWeight: boolean;
  brinePct?: number;
  brinePctRange?: [number, number];
  suitable: boolean;
  why: string;
  gPerTsp: number;
  gPerTspRange: [number, number];
  source: string;
};

/** Said beside every salt or sugar amount converted from a spoon or cup. */
export const BY_SPOON_NOTE =
  'By weight is exact; by spoon or cup is approximate (brand, crystal and how the spoon is filled change it): weigh it when it matters.';

const brine = (grams: number, waterMl: number) => (grams / (grams + waterMl * WATER_G_PER_ML)) * 100;

/** Weight of an amount of salt given by volume or weight, and the brine strength in water. */
export function saltToGrams({ salt, amount, unit, waterMl }: SaltToGramsInput): SaltToGramsResult {
  const kind = checkChoice(salt, SALT_KINDS, 'salt', 'a kind of salt');
  const info = SALTS[kind];
  const value = checkNumber(amount, RULES.amount);
  const grams = gramsOf(value, unit, info.gPerTsp * 48, 'the salt');
  const byWeight = isUnit(unit) && unitKind(unit) === 'mass';
  const gramsRange: [number, number] = byWeight
    ? [grams, grams]
    : [(grams * info.gPerTspRange[0]) / info.gPerTsp, (grams * info.gPerTspRange[1]) / info.gPerTsp];
  const result: SaltToGramsResult = {
    grams,
    gramsRange,
    byWeight,
    suitable: info.suitable,
    why: info.why,
    gPerTsp: info.gPerTsp,
    gPerTspRange: info.gPerTspRange,
    source: info.gPerTspSource,
  };
  if (waterMl !== undefined) {
    const water = checkNumber(waterMl, RULES.waterMl);
    if (grams + water <= 0) throw new PreservingError('invalid', 'Enter some salt or water: both are 0.', 'waterMl');
    result.brinePct = brine(grams, water);
    result.brinePctRange = [brine(gramsRange[0], water), brine(gramsRange[1], water)];
  }
  return result;
}

/** Salt for a brine of a given strength by weight (salt ÷ (salt + water) × 100). */
export function saltForBrine({ salt, waterMl, brinePct }: { salt: SaltKind | string; waterMl: number; brinePct: number }): {
  grams: number;
  teaspoons: number;
  teaspoonsRange: [number, number];
} {
  const kind = checkChoice(salt, SALT_KINDS, 'salt', 'a kind of salt');
  const water = checkNumber(waterMl, RULES.waterMl);
  const pct = checkNumber(brinePct, RULES.brinePct);
  const grams = (pct / (100 - pct)) * water * WATER_G_PER_ML;
  const [low, high] = SALTS[kind].gPerTspRange;
  return { grams, teaspoons: grams / SALTS[kind].gPerTsp, teaspoonsRange: [grams / high, grams / low] };
}

/**
 * Salt by weight of the fermented dill pickles' tested brine (per gallon of crock: 1/2 cup canning
 * salt in 8 cups water and 1/4 cup vinegar), computed over the span of canning salt's grams per
 * teaspoon, because the recipe gives the salt by cup: about 5.3 % to 6.9 %. The weakest end is the
 * floor a fermented batch is checked against (vinegar and water taken as 1 g per mL).
 */
export const FERMENTED_BRINE = (() => {
  const l = PRODUCTS['fermented-dill-pickles'].testedLiquid;
  const liquidG = (l.vinegarCups + l.waterCups) * mlPer('cup') * WATER_G_PER_ML;
  const saltTsp = (l.saltCups ?? 0) * 48;
  const [low, high] = SALTS.canning.gPerTspRange.map((g) => brine(saltTsp * g, liquidG));
  return {
    minPct: low,
    maxPct: high,
    source: `${l.source}; salt by weight computed with canning salt at ${SALTS.canning.gPerTspRange.join(' to ')} g per teaspoon`,
  };
})();
