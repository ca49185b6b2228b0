import { PreservingError, checkNumber, RULES } from './errors';

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
export const DEFAULT_PRODUCE_WATER_PCT = 95;

export type BrineAcidityInput = {
  vinegarMl: number;
  vinegarAcidityPct: number;
  waterMl: number;
  otherMl?: number;
  produceG?: number;
  produceWaterPct?: number;
};

export type BrineAcidityResult = {
  /** Acetic acid in g per 100 mL of the mixed liquid. */
  aceticAcidPct: number;
  /** Fraction of the liquid that is vinegar, 0–1. */
  vinegarShare: number;
  /** pH of the liquid alone from the weak-acid equation (no buffering by produce). */
  estimatedPh: number;
  /** Acetic acid g per 100 mL once the produce's water has mixed in (only with produce). */
  equilibratedAcidityPct?: number;
  /** pH of that diluted acid, still ignoring the produce's buffering (only with produce). */
  equilibratedPh?: number;
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

/** Acidity and estimated pH of a vinegar/water/other-liquid mix, and once produce water mixes in. */
export function brineAcidity(input: BrineAcidityInput): BrineAcidityResult {
  const vinegarMl = checkNumber(input.vinegarMl, RULES.vinegarMl);
  const acidity = checkNumber(input.vinegarAcidityPct, RULES.vinegarAcidityPct);
  const waterMl = checkNumber(input.waterMl, RULES.waterMl);
  const otherMl = input.otherMl === undefined ? 0 : checkNumber(input.otherMl, RULES.otherMl);
  const totalMl = vinegarMl + waterMl + otherMl;
  if (totalMl <= 0) throw new PreservingError('invalid', 'Enter some liquid: the vinegar, water and other liquid add up to 0 mL.', 'vinegarMl');

  // Vinegar acidity is grams of acetic acid per 100 mL (FDA CPG Sec. 525.825).
  const acidG = (vinegarMl * acidity) / 100;
  const aceticAcidPct = (acidG / totalMl) * 100;
  const estimatedPh = aceticAcidPh(molarFromPct(aceticAcidPct));
  const result: BrineAcidityResult = { aceticAcidPct, vinegarShare: vinegarMl / totalMl, estimatedPh, warnings: [] };

  if (acidity < MIN_VINEGAR_ACIDITY_PCT) {
    result.warnings.push(`This vinegar is below ${MIN_VINEGAR_ACIDITY_PCT}% acidity. Tested pickle recipes call for vinegar of at least 5% acidity; weaker vinegar cannot be made up by guessing.`);
  }
  if (input.produceG !== undefined) {
    const produceG = checkNumber(input.produceG, RULES.produceG);
    const waterPct =
      input.produceWaterPct === undefined ? DEFAULT_PRODUCE_WATER_PCT : checkNumber(input.produceWaterPct, RULES.produceWaterPct);
    // 1 g of produce water taken as 1 mL (water is 0.998 g/mL at 20 °C).
    const produceWaterMl = (produceG * waterPct) / 100;
    result.equilibratedAcidityPct = (acidG / (totalMl + produceWaterMl)) * 100;
    result.equilibratedPh = aceticAcidPh(molarFromPct(result.equilibratedAcidityPct));
    result.warnings.push(
      'Produce also buffers the acid, so the real pH in the jar settles higher than this estimate. Only the tested recipe, or a calibrated pH meter, tells you the finished pH.',
    );
  }
  const worstPh = result.equilibratedPh ?? estimatedPh;
  if (worstPh > ACID_FOOD_PH) {
    result.warnings.push(`The estimated pH is above ${ACID_FOOD_PH}, the line for acid foods: this mix is not acid enough for a boiling-water canner.`);
  }
  return result;
}
