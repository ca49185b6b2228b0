import { ACID_FOOD_PH, brineAcidity, MIN_VINEGAR_ACIDITY_PCT } from '@/lib/preserving/acidity';
import { PreservingError } from '@/lib/preserving/errors';
import { headspaceCheck } from '@/lib/preserving/headspace';
import { processingTime } from '@/lib/preserving/processing';
import { getProduct, type JarSize, type ProductId } from '@/lib/preserving/products';
import type { PracticalDetails } from '@/lib/validations/practical';

// Automatic checks of a practical against the same functions the calculators use. A failed check is
// a flag with its reason; a flag never blocks submitting, it tells the learner and the instructor
// where the batch departs from the published numbers. Brinewright checks arithmetic only: passing
// every check does not make a batch safe.

export type FlagCheck = 'processing-time' | 'processing-method' | 'pack' | 'headspace' | 'vinegar-acidity' | 'dilution' | 'seals';

export type Flag = {
  check: FlagCheck;
  /** One sentence a learner can act on. */
  message: string;
  expected?: string;
  actual?: string;
  source?: string;
};

export type Expectations = {
  productName?: string;
  processing?: { minutes: number; method: string; altitudeBand: { fromFt: number; toFt: number | null }; source: string } | { unavailable: string };
  lowTemperaturePasteurization?: { waterTempF: readonly number[]; minutes: number } | null;
  headspace?: { recommendedIn: number };
  brine?: { aceticAcidPct: number; vinegarShare: number; estimatedPh: number };
  pack?: 'raw' | 'hot';
};

type Input = Partial<PracticalDetails>;

/**
 * The most dilute pickling liquid among the tested recipes of the product list: quick fresh-pack
 * dill pickles, 1½ quarts of 5 % vinegar to 2 quarts of water (USDA Complete Guide to Home Canning,
 * AIB 539, rev. 2015, Guide 6), i.e. 5 % × 6/14 ≈ 2.14 % acetic acid (computed from the recipe).
 */
export const MIN_BRINE_ACETIC_ACID_PCT = (5 * 6) / 14;
const MIN_BRINE_SOURCE = 'USDA Complete Guide to Home Canning (AIB 539, rev. 2015), Guide 6, "Quick fresh-pack dill pickles" (6 cups 5 % vinegar to 8 cups water)';

const JAR_LABEL: Record<string, string> = { 'half-pint': 'half-pint', pint: 'pint', quart: 'quart' };
const fmt = (n: number, digits = 2) => String(Number(n.toFixed(digits)));
const band = (b: { fromFt: number; toFt: number | null }) => (b.toFt === null ? `above ${b.fromFt.toLocaleString('en-US')} ft` : `${b.fromFt.toLocaleString('en-US')}–${b.toFt.toLocaleString('en-US')} ft`);
const isNumber = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

function productOf(id: unknown) {
  if (typeof id !== 'string') return null;
  try {
    return getProduct(id as ProductId);
  } catch {
    return null;
  }
}

/** The published numbers for the batch as far as the input allows (for the submission page and the form). */
export function computeExpectations(input: Input): Expectations {
  const out: Expectations = {};
  const product = productOf(input.product);
  if (product) {
    out.productName = product.name;
    out.pack = product.pack;
    try {
      out.headspace = { recommendedIn: headspaceCheck({ product: input.product as ProductId }).recommendedIn };
    } catch {
      // no recommendation for this product
    }
    if (input.jar && isNumber(input.altitudeFt) && input.altitudeFt >= 0) {
      try {
        const t = processingTime({ product: input.product as ProductId, jar: input.jar as JarSize, altitudeFt: input.altitudeFt });
        out.processing = { minutes: t.minutes, method: t.method, altitudeBand: t.altitudeBand, source: t.source };
        out.lowTemperaturePasteurization = t.lowTemperaturePasteurization ?? null;
      } catch (error) {
        if (!(error instanceof PreservingError)) throw error;
        out.processing = { unavailable: error.message };
      }
    }
  }
  if (isNumber(input.vinegarMl) && isNumber(input.vinegarAcidityPct) && isNumber(input.waterMl) && input.vinegarMl > 0 && input.vinegarAcidityPct > 0 && input.waterMl >= 0) {
    try {
      const b = brineAcidity({ vinegarMl: input.vinegarMl, vinegarAcidityPct: input.vinegarAcidityPct, waterMl: input.waterMl });
      out.brine = { aceticAcidPct: b.aceticAcidPct, vinegarShare: b.vinegarShare, estimatedPh: b.estimatedPh };
    } catch (error) {
      if (!(error instanceof PreservingError)) throw error;
    }
  }
  return out;
}

/** The batch fields checkPractical reads (a check whose fields are empty is skipped, not passed). */
export const CHECK_INPUTS = ['product', 'pack', 'jar', 'headspaceIn', 'vinegarAcidityPct', 'vinegarMl', 'waterMl', 'method', 'altitudeFt', 'minutes', 'unsealedJars'] as const satisfies readonly (keyof PracticalDetails)[];
export type CheckInput = (typeof CHECK_INPUTS)[number];

/** Every failed check for the batch; checks whose inputs are missing are skipped, so the form can call it as the learner types. */
export function checkPractical(input: Input): Flag[] {
  const flags: Flag[] = [];
  const product = productOf(input.product);
  const jar = input.jar ? JAR_LABEL[input.jar] ?? input.jar : '';

  // Processing time for the product, jar and altitude (the product's published table).
  if (product && input.jar && isNumber(input.altitudeFt) && input.altitudeFt >= 0 && input.method) {
    let published: ReturnType<typeof processingTime> | null = null;
    try {
      published = processingTime({ product: input.product as ProductId, jar: input.jar as JarSize, altitudeFt: input.altitudeFt });
    } catch (error) {
      if (!(error instanceof PreservingError)) throw error;
      flags.push({
        check: 'processing-time',
        message: `There is no published boiling-water time for a ${jar} of ${product.name} at ${input.altitudeFt.toLocaleString('en-US')} ft in Brinewright's tables. Follow a tested recipe and your local extension office's guidance for this jar and altitude.`,
        actual: isNumber(input.minutes) ? `${input.minutes} min` : undefined,
      });
    }
    if (published && isNumber(input.minutes)) {
      if (input.method === 'boiling-water' && input.minutes < published.minutes) {
        flags.push({
          check: 'processing-time',
          message: `Processed ${input.minutes} min, shorter than the published ${published.minutes} min for a ${jar} of ${product.name} at ${band(published.altitudeBand)}. Time starts when the water returns to a full boil.`,
          expected: `${published.minutes} min`,
          actual: `${input.minutes} min`,
          source: published.source,
        });
      }
      if (input.method === 'low-temperature-pasteurization') {
        const ltp = published.lowTemperaturePasteurization;
        if (!ltp) {
          flags.push({
            check: 'processing-method',
            message: `Low-temperature pasteurization is published only for some cucumber pickle recipes, not for ${product.name}. Use a boiling-water canner for the recipe's full time (${published.minutes} min here).`,
            expected: `boiling water, ${published.minutes} min`,
            actual: 'low-temperature pasteurization',
            source: published.source,
          });
        } else if (input.minutes < ltp.minutes) {
          flags.push({
            check: 'processing-time',
            message: `Pasteurized ${input.minutes} min; the published low-temperature treatment is ${ltp.minutes} min with the water held at ${ltp.waterTempF[0]}–${ltp.waterTempF[1]} °F, checked with a thermometer.`,
            expected: `${ltp.minutes} min at ${ltp.waterTempF[0]}–${ltp.waterTempF[1]} °F`,
            actual: `${input.minutes} min`,
            source: published.source,
          });
        }
      }
    }
  }

  // The pack the published time assumes.
  if (product && input.pack && input.pack !== product.pack) {
    flags.push({
      check: 'pack',
      message: `The published time for ${product.name} is for a ${product.pack} pack; this batch was a ${input.pack} pack. Follow the tested recipe's pack.`,
      expected: `${product.pack} pack`,
      actual: `${input.pack} pack`,
      source: product.source,
    });
  }

  // Measured headspace against the recommendation.
  if (product && isNumber(input.headspaceIn)) {
    try {
      const h = headspaceCheck({ product: input.product as ProductId, measuredIn: input.headspaceIn });
      if (h.verdict && h.verdict !== 'ok') {
        flags.push({
          check: 'headspace',
          message: `Headspace ${fmt(input.headspaceIn, 3)} in is ${h.verdict === 'too-little' ? 'less' : 'more'} than the recommended ${fmt(h.recommendedIn, 3)} in.${h.why ? ` ${h.why}` : ''}`,
          expected: `${fmt(h.recommendedIn, 3)} in`,
          actual: `${fmt(input.headspaceIn, 3)} in`,
          source: product.source,
        });
      }
    } catch (error) {
      if (!(error instanceof PreservingError)) throw error;
    }
  }

  // Vinegar strength: pickling vinegar is 5 % acidity.
  if (isNumber(input.vinegarAcidityPct) && input.vinegarAcidityPct < MIN_VINEGAR_ACIDITY_PCT) {
    flags.push({
      check: 'vinegar-acidity',
      message: `The vinegar is ${fmt(input.vinegarAcidityPct)} % acidity; tested pickle recipes call for vinegar of at least ${MIN_VINEGAR_ACIDITY_PCT} % acidity. Check the label, and never use homemade vinegar of unknown strength.`,
      expected: `≥ ${MIN_VINEGAR_ACIDITY_PCT} %`,
      actual: `${fmt(input.vinegarAcidityPct)} %`,
      source: 'USDA Complete Guide to Home Canning (AIB 539, rev. 2015), Guide 6',
    });
  }

  // Dilution: the brine's acidity from the vinegar and water amounts. Fermented pickles take their
  // acid from the fermentation, so only their vinegar's strength is checked.
  if (
    input.product !== 'fermented-dill-pickles' &&
    isNumber(input.vinegarMl) &&
    isNumber(input.vinegarAcidityPct) &&
    isNumber(input.waterMl) &&
    input.vinegarMl > 0 &&
    input.vinegarAcidityPct > 0 &&
    input.waterMl >= 0
  ) {
    try {
      const b = brineAcidity({ vinegarMl: input.vinegarMl, vinegarAcidityPct: input.vinegarAcidityPct, waterMl: input.waterMl });
      const actual = `${fmt(b.aceticAcidPct)} % acetic acid (${Math.round(b.vinegarShare * 100)} % of the liquid is vinegar)`;
      if (b.estimatedPh > ACID_FOOD_PH) {
        flags.push({
          check: 'dilution',
          message: `The brine's estimated pH is ${fmt(b.estimatedPh)}, above ${ACID_FOOD_PH}, the line for acid foods: this mix is not acid enough for a boiling-water canner.`,
          expected: `pH ≤ ${ACID_FOOD_PH}`,
          actual: `pH ${fmt(b.estimatedPh)}`,
          source: '21 CFR 114.3 (acidified foods)',
        });
      } else if (b.aceticAcidPct < MIN_BRINE_ACETIC_ACID_PCT - 1e-9) {
        flags.push({
          check: 'dilution',
          message: `The brine is ${fmt(b.aceticAcidPct)} % acetic acid, more dilute than any of the tested recipes Brinewright lists (the weakest, quick fresh-pack dills, is about ${fmt(MIN_BRINE_ACETIC_ACID_PCT)} %). Never add water beyond the tested recipe's proportions.`,
          expected: `≥ ${fmt(MIN_BRINE_ACETIC_ACID_PCT)} % acetic acid`,
          actual,
          source: MIN_BRINE_SOURCE,
        });
      }
    } catch (error) {
      if (!(error instanceof PreservingError)) throw error;
    }
  }

  // Seals.
  if (isNumber(input.unsealedJars) && input.unsealedJars > 0) {
    flags.push({
      check: 'seals',
      message: `${input.unsealedJars} jar${input.unsealedJars === 1 ? '' : 's'} did not seal. Reprocess within 24 hours with a new lid for the full time, or refrigerate and use soon; do not store unsealed jars on the shelf.`,
      expected: '0 unsealed',
      actual: `${input.unsealedJars} unsealed`,
      source: 'USDA Complete Guide to Home Canning (AIB 539, rev. 2015), Guide 1',
    });
  }
  return flags;
}
