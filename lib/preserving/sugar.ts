import { PreservingError, checkChoice, checkNumber, RULES } from './errors';
import { gramsOf, isUnit, unitKind, type Unit } from './units';

export const SUGAR_KINDS = ['granulated', 'brown-packed'] as const;
export type SugarKind = (typeof SUGAR_KINDS)[number];

type SugarInfo = { name: string; gPerCup: number; gPerCupSource: string; why: string };

/**
 * Grams per level US cup. Sugar packs more steadily than flake salt, but a cup still varies by a
 * few percent with how it is filled: weigh it when a recipe gives weights.
 */
export const SUGARS: Record<SugarKind, SugarInfo> = {
  granulated: {
    name: 'White granulated sugar',
    gPerCup: 200,
    gPerCupSource: 'USDA FoodData Central, SR Legacy "Sugars, granulated", 1 cup = 200 g (from memory)',
    why: 'White granulated sugar is what most tested sweet-pickle recipes measure. Sugar is there for flavour and texture: the vinegar, not the sugar, is what makes a quick pickle acid enough.',
  },
  'brown-packed': {
    name: 'Brown sugar, packed into the cup',
    gPerCup: 220,
    gPerCupSource: 'USDA FoodData Central, SR Legacy "Sugars, brown", 1 cup packed = 220 g (from memory)',
    why: 'Brown sugar darkens the pickle and the syrup and tastes stronger. Use it where the tested recipe calls for it, pressed firmly into the cup.',
  },
};

const WATER_G_PER_ML = 1;

export type SugarToGramsInput = { sugar: SugarKind | string; amount: number; unit: Unit | string; liquidMl?: number };
/** `byWeight` false means the grams come from a cup figure: approximate (see BY_SPOON_NOTE in salt.ts). */
export type SugarToGramsResult = { grams: number; gPerCup: number; byWeight: boolean; source: string; syrupPct?: number; why: string };

/** Weight of an amount of sugar given by volume or weight, and its share by weight of a syrup. */
export function sugarToGrams({ sugar, amount, unit, liquidMl }: SugarToGramsInput): SugarToGramsResult {
  const kind = checkChoice(sugar, SUGAR_KINDS, 'sugar', 'a kind of sugar');
  const info = SUGARS[kind];
  const value = checkNumber(amount, RULES.sugarAmount);
  const grams = gramsOf(value, unit, info.gPerCup, 'the sugar');
  const byWeight = isUnit(unit) && unitKind(unit) === 'mass';
  const result: SugarToGramsResult = { grams, gPerCup: info.gPerCup, byWeight, source: info.gPerCupSource, why: info.why };
  if (liquidMl !== undefined) {
    const liquid = checkNumber(liquidMl, RULES.liquidMl);
    if (grams + liquid <= 0) throw new PreservingError('invalid', 'Enter some sugar or liquid: both are 0.', 'liquidMl');
    // Vinegar and water are both taken as 1 g per mL (5 % vinegar is about 1.006 g/mL).
    result.syrupPct = (grams / (grams + liquid * WATER_G_PER_ML)) * 100;
  }
  return result;
}
