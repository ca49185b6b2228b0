import { PreservingError, checkChoice, checkNumber, RULES } from './errors';
import { gramsOf, type Unit } from './units';

export const SALT_KINDS = ['canning', 'table', 'kosher-flake', 'kosher-coarse', 'sea-fine'] as const;
export type SaltKind = (typeof SALT_KINDS)[number];

type SaltInfo = { name: string; gPerTsp: number; gPerTspSource: string; suitable: boolean; why: string };

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
    gPerTspSource: 'about 6 g per teaspoon, fine pure salt (package labels, from memory; unconfirmed)',
    suitable: true,
    why: 'Canning or pickling salt is pure salt with no anti-caking agent or iodine: it is what tested pickle recipes are measured with.',
  },
  table: {
    name: 'Table salt (iodized or with anti-caking agent)',
    gPerTsp: 6,
    gPerTspSource: 'USDA FoodData Central SR Legacy, "Salt, table", 1 tsp = 6.0 g (from memory)',
    suitable: false,
    why: 'Not recommended for pickling: its anti-caking agents can make the brine cloudy and iodine can darken pickles. Use canning or pickling salt.',
  },
  'kosher-flake': {
    name: 'Kosher salt, light hollow flakes',
    gPerTsp: 2.8,
    gPerTspSource: 'package label, 1/4 tsp = 0.7 g (from memory; unconfirmed)',
    suitable: false,
    why: 'Flake salt varies in density, so a spoonful does not hold a reliable amount: USDA does not recommend it for pickling. If you must use it, weigh it.',
  },
  'kosher-coarse': {
    name: 'Kosher salt, dense rolled flakes',
    gPerTsp: 4.8,
    gPerTspSource: 'package label, 1/4 tsp = 1.2 g (from memory; unconfirmed)',
    suitable: false,
    why: 'Flake salt varies in density, so a spoonful does not hold a reliable amount: USDA does not recommend it for pickling. If you must use it, weigh it.',
  },
  'sea-fine': {
    name: 'Fine sea salt',
    gPerTsp: 5.6,
    gPerTspSource: 'about 5.6 g per teaspoon (from memory; unconfirmed)',
    suitable: false,
    why: 'Not the salt tested recipes are measured with: minerals or anti-caking agents in sea salt can cloud the brine or discolor pickles (common practice). Use canning or pickling salt.',
  },
};

/** Water's mass per millilitre taken as 1 g (it is 0.998 g at 20 °C; the difference is 0.2 %). */
const WATER_G_PER_ML = 1;

export type SaltToGramsInput = { salt: SaltKind | string; amount: number; unit: Unit | string; waterMl?: number };
export type SaltToGramsResult = { grams: number; brinePct?: number; suitable: boolean; why: string; gPerTsp: number };

/** Weight of an amount of salt given by volume or weight, and the brine strength in water. */
export function saltToGrams({ salt, amount, unit, waterMl }: SaltToGramsInput): SaltToGramsResult {
  const kind = checkChoice(salt, SALT_KINDS, 'salt', 'a kind of salt');
  const info = SALTS[kind];
  const value = checkNumber(amount, RULES.amount);
  const grams = gramsOf(value, unit, info.gPerTsp * 48, 'the salt');
  const result: SaltToGramsResult = { grams, suitable: info.suitable, why: info.why, gPerTsp: info.gPerTsp };
  if (waterMl !== undefined) {
    const water = checkNumber(waterMl, RULES.waterMl);
    if (grams + water <= 0) throw new PreservingError('invalid', 'Enter some salt or water: both are 0.', 'waterMl');
    result.brinePct = (grams / (grams + water * WATER_G_PER_ML)) * 100;
  }
  return result;
}

/** Salt for a brine of a given strength by weight (salt ÷ (salt + water) × 100). */
export function saltForBrine({ salt, waterMl, brinePct }: { salt: SaltKind | string; waterMl: number; brinePct: number }): { grams: number; teaspoons: number } {
  const kind = checkChoice(salt, SALT_KINDS, 'salt', 'a kind of salt');
  const water = checkNumber(waterMl, RULES.waterMl);
  const pct = checkNumber(brinePct, RULES.brinePct);
  const grams = ((pct / (100 - pct)) * water * WATER_G_PER_ML);
  return { grams, teaspoons: grams / SALTS[kind].gPerTsp };
}
