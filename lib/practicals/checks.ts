import { brineAcidity, MIN_VINEGAR_ACIDITY_PCT } from '@/lib/preserving/acidity';
import { PreservingError } from '@/lib/preserving/errors';
import { headspaceCheck } from '@/lib/preserving/headspace';
import { processingTime, sterilizeJarsFor, STERILIZE_BELOW_MINUTES } from '@/lib/preserving/processing';
import { FERMENTED_BRINE } from '@/lib/preserving/salt';
import { getProduct, type JarSize, type ProductId } from '@/lib/preserving/products';
import type { PracticalDetails } from '@/lib/validations/practical';

// Automatic checks of a practical against the same functions the calculators use. A failed check is
// a flag with its reason; a flag never blocks submitting, it tells the learner and the instructor
// where the batch departs from the published numbers. Brinewright checks arithmetic only: passing
// every check does not make a batch safe.

export type FlagCheck =
  'processing-time' | 'processing-method' | 'sterilized-jars' | 'pack' | 'headspace' | 'vinegar-acidity' | 'dilution' | 'brine-strength' | 'seals';

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
  /** The batch's liquid beside its product's tested liquid (no pH: an estimate would read as reassurance). */
  brine?: { aceticAcidPct: number; vinegarShare: number; testedAceticAcidPct: number; testedName: string; source: string };
  /** Fermented pickles: the brine's salt by weight beside the tested recipe's. */
  brineStrength?: { saltPct?: number; minPct: number; maxPct: number; source: string };
  /** Processes under 10 minutes: the jars are sterilised first. */
  sterilizeJars?: { boilMinutes: number; source: string };
  pack?: 'raw' | 'hot';
};

type Input = Partial<PracticalDetails>;

const FERMENTED = 'fermented-dill-pickles';

/** Salt by weight of a brine from grams of salt and millilitres of water and vinegar (1 g per mL). */
const saltPctOf = (saltG: number, liquidMl: number) => (saltG / (saltG + liquidMl)) * 100;
const pct2 = (n: number) => Math.round(n * 100) / 100;

const JAR_LABEL: Record<string, string> = { 'half-pint': 'half-pint', pint: 'pint', quart: 'quart' };
const fmt = (n: number, digits = 2) => String(Number(n.toFixed(digits)));
const band = (b: { fromFt: number; toFt: number | null }) =>
  b.toFt === null ? `above ${b.fromFt.toLocaleString('en-US')} ft` : `${b.fromFt.toLocaleString('en-US')}–${b.toFt.toLocaleString('en-US')} ft`;
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
    if (input.jar && isNumber(input.altitudeFt)) {
      try {
        const t = processingTime({ product: input.product as ProductId, jar: input.jar as JarSize, altitudeFt: input.altitudeFt });
        out.processing = { minutes: t.minutes, method: t.method, altitudeBand: t.altitudeBand, source: t.source };
        out.lowTemperaturePasteurization = t.lowTemperaturePasteurization ?? null;
        if (t.sterilizeJars) out.sterilizeJars = { boilMinutes: t.sterilizeJars.boilMinutes, source: t.sterilizeJars.source };
      } catch (error) {
        if (!(error instanceof PreservingError)) throw error;
        out.processing = { unavailable: error.message };
      }
    }
  }
  if (product?.id === FERMENTED) {
    const liquid = (isNumber(input.waterMl) ? input.waterMl : 0) + (isNumber(input.vinegarMl) ? input.vinegarMl : 0);
    const saltPct = isNumber(input.saltG) && input.saltG > 0 && liquid > 0 ? saltPctOf(input.saltG, liquid) : undefined;
    out.brineStrength = { saltPct, minPct: FERMENTED_BRINE.minPct, maxPct: FERMENTED_BRINE.maxPct, source: FERMENTED_BRINE.source };
  } else if (
    isNumber(input.vinegarMl) &&
    isNumber(input.vinegarAcidityPct) &&
    isNumber(input.waterMl) &&
    input.vinegarMl > 0 &&
    input.vinegarAcidityPct > 0 &&
    input.waterMl >= 0
  ) {
    try {
      const b = brineAcidity({ vinegarMl: input.vinegarMl, vinegarAcidityPct: input.vinegarAcidityPct, waterMl: input.waterMl, product: product?.id });
      out.brine = {
        aceticAcidPct: b.aceticAcidPct,
        vinegarShare: b.vinegarShare,
        testedAceticAcidPct: b.tested.aceticAcidPct,
        testedName: b.tested.name,
        source: b.tested.source,
      };
    } catch (error) {
      if (!(error instanceof PreservingError)) throw error;
    }
  }
  return out;
}

/** The batch fields checkPractical reads (a check whose fields are empty is skipped, not passed). */
export const CHECK_INPUTS = [
  'product',
  'pack',
  'jar',
  'headspaceIn',
  'vinegarAcidityPct',
  'vinegarMl',
  'waterMl',
  'saltG',
  'method',
  'altitudeFt',
  'minutes',
  'unsealedJars',
] as const satisfies readonly (keyof PracticalDetails)[];
export type CheckInput = (typeof CHECK_INPUTS)[number];

/** The check inputs that matter for a product: the brine's salt is read for fermented pickles only. */
export const checkInputsFor = (product: unknown): readonly CheckInput[] => CHECK_INPUTS.filter((name) => name !== 'saltG' || product === FERMENTED);

/** Every failed check for the batch; checks whose inputs are missing are skipped, so the form can call it as the learner types. */
export function checkPractical(input: Input): Flag[] {
  const flags: Flag[] = [];
  const product = productOf(input.product);
  const jar = input.jar ? (JAR_LABEL[input.jar] ?? input.jar) : '';

  // Processing time for the product, jar and altitude (the product's published table).
  if (product && input.jar && isNumber(input.altitudeFt) && input.method) {
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

  // Under 10 minutes in boiling water the jars must have been sterilised; the form does not ask, so it is always said.
  if (input.method === 'boiling-water' && isNumber(input.minutes) && input.minutes < STERILIZE_BELOW_MINUTES) {
    const sterilize = sterilizeJarsFor(input.minutes, isNumber(input.altitudeFt) ? input.altitudeFt : 0)!;
    flags.push({
      check: 'sterilized-jars',
      message: `Processed ${input.minutes} min, under ${STERILIZE_BELOW_MINUTES} minutes: the jars must be sterilised before filling (boil the empty jars ${isNumber(input.altitudeFt) ? `${sterilize.boilMinutes} minutes at ${input.altitudeFt.toLocaleString('en-US')} ft` : '10 minutes up to 1,000 ft, 1 more minute for each further 1,000 ft'}). Say in the notes how the jars were sterilised.`,
      expected: isNumber(input.altitudeFt) ? `jars boiled empty ${sterilize.boilMinutes} min` : 'sterilised jars',
      actual: `${input.minutes} min process`,
      source: sterilize.source,
    });
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

  // Dilution: each vinegar-pickled product against its own tested liquid (with no product chosen, the
  // weakest tested liquid). Compared at 0.01 %, the precision the flag shows.
  if (
    input.product !== FERMENTED &&
    isNumber(input.vinegarMl) &&
    isNumber(input.vinegarAcidityPct) &&
    isNumber(input.waterMl) &&
    input.vinegarMl > 0 &&
    input.vinegarAcidityPct > 0 &&
    input.waterMl >= 0
  ) {
    try {
      const b = brineAcidity({ vinegarMl: input.vinegarMl, vinegarAcidityPct: input.vinegarAcidityPct, waterMl: input.waterMl, product: product?.id });
      if (b.belowTested) {
        const tested = b.tested.weakest
          ? `the weakest tested liquid Brinewright lists (${b.tested.name.toLowerCase()})`
          : `the tested liquid of ${b.tested.name.toLowerCase()}`;
        flags.push({
          check: 'dilution',
          message: `The brine is ${fmt(b.aceticAcidPct)} % acetic acid, weaker than ${tested}, ${fmt(b.tested.aceticAcidPct)} %. Never add water beyond the tested recipe's proportions.`,
          expected: `≥ ${fmt(b.tested.aceticAcidPct)} % acetic acid`,
          actual: `${fmt(b.aceticAcidPct)} % acetic acid (${Math.round(b.vinegarShare * 100)} % of the liquid is vinegar)`,
          source: b.tested.source,
        });
      }
    } catch (error) {
      if (!(error instanceof PreservingError)) throw error;
    }
  }

  // Fermented pickles make their own acid: their check is the brine's salt by weight.
  if (input.product === FERMENTED && isNumber(input.saltG) && isNumber(input.waterMl) && input.saltG >= 0 && input.waterMl > 0) {
    const liquidMl = input.waterMl + (isNumber(input.vinegarMl) && input.vinegarMl > 0 ? input.vinegarMl : 0);
    const saltPct = saltPctOf(input.saltG, liquidMl);
    if (pct2(saltPct) < pct2(FERMENTED_BRINE.minPct)) {
      flags.push({
        check: 'brine-strength',
        message: `The brine is ${fmt(saltPct)} % salt by weight, weaker than the tested fermented dill brine (${fmt(FERMENTED_BRINE.minPct)} to ${fmt(FERMENTED_BRINE.maxPct)} %, 1/2 cup canning salt per 8 1/4 cups of water and vinegar). Too little salt lets spoilage organisms grow before the fermentation makes the acid.`,
        expected: `≥ ${fmt(FERMENTED_BRINE.minPct)} % salt by weight`,
        actual: `${fmt(saltPct)} % salt by weight`,
        source: FERMENTED_BRINE.source,
      });
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
