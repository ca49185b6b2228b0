import { PreservingError, checkNumber, RULES } from './errors';
import { WEAKEST_TESTED, getProduct, testedAceticAcidPct, type Confidence, type ProductId } from './products';

/** Pickling vinegar strength the tested recipes call for: 5 % acidity ("50 grain"), white or cider
 * (USDA Complete Guide to Home Canning, rev. 2015, Guide 6, "Ingredients": vinegar). */
export const MIN_VINEGAR_ACIDITY_PCT = 5;
/** Acetic acid pKa at 25 °C (CRC Handbook of Chemistry and Physics, dissociation constants of
 * organic acids in aqueous solution): 4.756. */
export const ACETIC_ACID_PKA = 4.756;
export const ACETIC_ACID_KA = 10 ** -ACETIC_ACID_PKA;
/** Molar mass of CH3COOH from the IUPAC standard atomic weights: 60.052 g/mol. */
export const ACETIC_ACID_MOLAR_MASS = 60.052;
/** The pH line between acid and low-acid foods (21 CFR 113.3 and 114.3). */
export const ACID_FOOD_PH = 4.6;
/** Water in cucumbers when the produce's own figure is not given: about 95 g per 100 g
 * (USDA FoodData Central, SR Legacy, "Cucumber, with peel, raw": 95.2 g; value from memory). */
export const PRODUCE_WATER_SOURCE = 'USDA FoodData Central, SR Legacy, "Cucumber, with peel, raw": 95.2 g water per 100 g (from memory)';
export const DEFAULT_PRODUCE_WATER_PCT = 95;

/** Acetic acid a food vinegar's label carries at the least: 4 g per 100 mL at 20 °C (FDA Compliance
 * Policy Guide Sec. 525.825, "Vinegar, definitions"). */
export const MIN_FOOD_VINEGAR_ACIDITY_PCT = 4;
/** Above this the vinegar is stronger than table and pickling vinegars are sold (they are labelled
 * 4 % to about 7 %; stronger ones are sold for cleaning or weeds). Common practice, no published limit. */
export const MAX_TABLE_VINEGAR_ACIDITY_PCT = 7;

/** Shown beside every estimated pH: it is the liquid's, before the produce goes in. */
/** How the liquid's pH is estimated, for the calculator's "how this is worked out" fold. */
export const PH_METHOD = 'weak-acid equation, acetic acid pKa 4.756, CRC Handbook';
/** The caution in plain words, shown beside the pH wherever it appears. */
export const PH_CAUTION_PLAIN =
  'This is the pH of the liquid alone, before the produce goes in. Produce buffers the acid, so the jar settles higher: only the tested recipe, or a calibrated pH meter, tells you the finished pH.';
export const PH_CAUTION = PH_CAUTION_PLAIN.replace('before the produce goes in.', `before the produce goes in (${PH_METHOD}).`);

export type BrineAcidityInput = {
  vinegarMl: number;
  vinegarAcidityPct: number;
  waterMl: number;
  otherMl?: number;
  produceG?: number;
  produceWaterPct?: number;
  /** Compare with this product's tested liquid; without it, with the weakest tested liquid. */
  product?: string;
};

/** The tested liquid the mix was compared with. */
export type TestedComparison = {
  product: ProductId;
  name: string;
  aceticAcidPct: number;
  /** True when no product was chosen: the weakest tested liquid of the product table. */
  weakest: boolean;
  sugarCountsInVolume: false;
  source: string;
  confidence: Confidence;
};

export type BrineAcidityResult = {
  /** Acetic acid in g per 100 mL of the mixed liquid. */
  aceticAcidPct: number;
  /** Fraction of the liquid that is vinegar, 0–1. */
  vinegarShare: number;
  /** pH of the liquid before the produce goes in, from the weak-acid equation: never the jar's pH (see phCaution). */
  estimatedPh: number;
  phCaution: string;
  /** Acetic acid g per 100 mL once the produce's water has mixed in (only with produce); no pH is given for it. */
  equilibratedAcidityPct?: number;
  tested: TestedComparison;
  /** True when the liquid is weaker than the tested liquid it was compared with (at 0.01 %, the precision shown). */
  belowTested: boolean;
  warnings: string[];
};
/**
 * pH of an acetic acid solution of molar concentration c from the exact weak-acid quadratic
 * [H+] = (−Ka + √(Ka² + 4·Ka·c)) / 2 (activity coefficients taken as 1; water's own ions ignored,
 * which matters only near pH 7).
 */
export function aceticAcidPh(molar: number): number {
  if (!(molar > 0)) return 7;
  const ka = ACETIC_ACID_KA;
  const h = (-ka + Math.sqrt(ka * ka + 4 * ka * molar)) / 2;
  return -Math.log10(h);
}

/** Molar concentration of acetic acid from g per 100 mL. */
export const molarFromPct = (gPer100Ml: number) => (gPer100Ml * 10) / ACETIC_ACID_MOLAR_MASS;

const pct2 = (n: number) => Math.round(n * 100) / 100;
const shownPct = (n: number) => pct2(n).toLocaleString('en-US', { maximumFractionDigits: 2 });

/** The tested liquid to compare with: the product's own, or the weakest tested one. */
function comparisonFor(productId: string | undefined): TestedComparison {
  if (productId === undefined) {
    const { product, aceticAcidPct } = WEAKEST_TESTED;
    return {
      product: product.id,
      name: product.name,
      aceticAcidPct,
      weakest: true,
      sugarCountsInVolume: false,
      source: product.testedLiquid.source,
      confidence: product.testedLiquid.confidence,
    };
  }
  const product = getProduct(productId);
  const l = product.testedLiquid;
  return {
    product: product.id,
    name: product.name,
    aceticAcidPct: testedAceticAcidPct(l),
    weakest: false,
    sugarCountsInVolume: false,
    source: l.source,
    confidence: l.confidence,
  };
}

/** Acidity of a vinegar/water/other-liquid mix compared with a tested liquid, the liquid's estimated pH
 * before the produce, and the acid once produce water mixes in. It warns; it never calls a mix safe. */
export function brineAcidity(input: BrineAcidityInput): BrineAcidityResult {
  const vinegarMl = checkNumber(input.vinegarMl, RULES.vinegarMl);
  const acidity = checkNumber(input.vinegarAcidityPct, RULES.vinegarAcidityPct);
  const waterMl = checkNumber(input.waterMl, RULES.waterMl);
  const otherMl = input.otherMl === undefined ? 0 : checkNumber(input.otherMl, RULES.otherMl);
  const tested = comparisonFor(input.product);
  const totalMl = vinegarMl + waterMl + otherMl;
  if (totalMl <= 0) throw new PreservingError('invalid', 'Enter some liquid: the vinegar, water and other liquid add up to 0 mL.', 'vinegarMl');

  // Vinegar acidity is grams of acetic acid per 100 mL (FDA CPG Sec. 525.825).
  const acidG = (vinegarMl * acidity) / 100;
  const aceticAcidPct = (acidG / totalMl) * 100;
  const estimatedPh = aceticAcidPh(molarFromPct(aceticAcidPct));
  const belowTested = pct2(aceticAcidPct) < pct2(tested.aceticAcidPct);
  const result: BrineAcidityResult = {
    aceticAcidPct,
    vinegarShare: vinegarMl / totalMl,
    estimatedPh,
    phCaution: PH_CAUTION,
    tested,
    belowTested,
    warnings: [],
  };

  if (acidity < MIN_FOOD_VINEGAR_ACIDITY_PCT) {
    result.warnings.push(
      `No food vinegar is labelled below ${MIN_FOOD_VINEGAR_ACIDITY_PCT}% acidity (FDA Compliance Policy Guide Sec. 525.825): check the label, and never pickle with a vinegar of unknown strength. Tested recipes call for ${MIN_VINEGAR_ACIDITY_PCT}% (USDA Complete Guide to Home Canning, Guide 6).`,
    );
  } else if (acidity < MIN_VINEGAR_ACIDITY_PCT) {
    result.warnings.push(
      `This vinegar is below ${MIN_VINEGAR_ACIDITY_PCT}% acidity. Tested pickle recipes call for vinegar of at least 5% acidity (USDA Complete Guide to Home Canning, Guide 6); weaker vinegar cannot be made up by guessing.`,
    );
  }
  if (acidity > MAX_TABLE_VINEGAR_ACIDITY_PCT) {
    result.warnings.push(
      `Vinegar above ${MAX_TABLE_VINEGAR_ACIDITY_PCT}% acidity is stronger than table and pickling vinegars are sold (common practice): vinegars sold for cleaning or weeds are not food. Use a food vinegar of ${MIN_VINEGAR_ACIDITY_PCT}% acidity, as the tested recipes do (USDA Complete Guide to Home Canning, Guide 6).`,
    );
  }
  if (belowTested) {
    const which = tested.weakest
      ? `weaker than the weakest tested liquid Brinewright knows, that of ${tested.name.toLowerCase()} (${shownPct(tested.aceticAcidPct)}%)`
      : `weaker than the tested liquid of ${tested.name.toLowerCase()} (${shownPct(tested.aceticAcidPct)}%)`;
    result.warnings.push(
      `This liquid is ${shownPct(aceticAcidPct)}% acetic acid, ${which}. Never dilute a pickling liquid below its tested recipe. Source: ${tested.source}.`,
    );
  }
  if (tested.product === 'fermented-dill-pickles') {
    result.warnings.push(
      "Fermented pickles take their acid from the fermentation, not from this vinegar: follow the tested recipe, and check the brine's salt by weight with the salt calculator.",
    );
  }
  if (input.produceG !== undefined) {
    const produceG = checkNumber(input.produceG, RULES.produceG);
    const waterPct = input.produceWaterPct === undefined ? DEFAULT_PRODUCE_WATER_PCT : checkNumber(input.produceWaterPct, RULES.produceWaterPct);
    // 1 g of produce water taken as 1 mL (water is 0.998 g/mL at 20 °C).
    const produceWaterMl = (produceG * waterPct) / 100;
    result.equilibratedAcidityPct = (acidG / (totalMl + produceWaterMl)) * 100;
    result.warnings.push(
      "The produce's water dilutes the acid and the produce buffers it, so the jar settles weaker and at a higher pH than the liquid alone. Only the tested recipe, or a calibrated pH meter, tells you the finished pH.",
    );
  }
  return result;
}
