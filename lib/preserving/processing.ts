import { ALTITUDE_RULE, checkChoice, checkNumber, outsideTable, RULES } from './errors';
import { ALTITUDE_BANDS, JAR_SIZES, MAX_TABLE_ALTITUDE_FT, getProduct, type AltitudeBand, type JarSize } from './products';

export type ProcessingTimeInput = { product: string; jar: JarSize | string; altitudeFt: number };
export type ProcessingTimeResult = {
  minutes: number;
  method: 'boiling-water';
  altitudeBand: AltitudeBand;
  source: string;
  /** USDA Guide 6: for the products that allow it, 180–185 °F water for 30 minutes, checked with a
   * thermometer, instead of the boiling-water time (it also keeps pickles firmer). */
  lowTemperaturePasteurization?: { waterTempF: [180, 185]; minutes: 30 };
  /** Processes under 10 minutes fill sterilised jars (see sterilizeJars). */
  sterilizeJars?: SterilizeJars;
};

/** Jars for a process under this many minutes in a boiling-water canner are sterilised first. */
export const STERILIZE_BELOW_MINUTES = 10;
export const STERILIZE_SOURCE =
  'USDA Complete Guide to Home Canning (AIB 539, rev. 2015), Guide 1, "Sterilization of empty jars": products processed less than 10 minutes go into sterile jars; boil empty jars 10 minutes below 1,000 ft and 1 more minute for each further 1,000 ft';
export type SterilizeJars = { boilMinutes: number; message: string; source: string };

/** Minutes to boil empty jars at an altitude: 10 up to 1,000 ft, then 1 more for each further
 * 1,000 ft or part of it (the longer reading of a part, as the safer one). Guide 1, as above. */
export function sterilizingMinutes(altitudeFt: number): number {
  checkNumber(altitudeFt, ALTITUDE_RULE);
  return 10 + Math.max(0, Math.ceil((altitudeFt - 1000) / 1000 - 1e-9));
}

/** The sterilising step for a process of `minutes` at an altitude, or undefined when 10 minutes or more. */
export function sterilizeJarsFor(minutes: number, altitudeFt: number): SterilizeJars | undefined {
  if (minutes >= STERILIZE_BELOW_MINUTES) return undefined;
  const boilMinutes = sterilizingMinutes(altitudeFt);
  return {
    boilMinutes,
    message: `This process is under ${STERILIZE_BELOW_MINUTES} minutes, so the jars must be sterilised before filling: boil the empty jars, right side up on the rack and covered by 1 inch of water, ${boilMinutes} minutes at this altitude (10 minutes up to 1,000 ft, 1 more minute for each further 1,000 ft).`,
    source: STERILIZE_SOURCE,
  };
}

/** Index of the altitude band in a table; a fraction of a foot above a band's top is the next band. */
export function altitudeBandIndex(altitudeFt: number, bands: readonly AltitudeBand[] = ALTITUDE_BANDS): number {
  checkNumber(altitudeFt, ALTITUDE_RULE);
  if (altitudeFt > MAX_TABLE_ALTITUDE_FT) {
    throw outsideTable(
      `The published processing tables go up to ${MAX_TABLE_ALTITUDE_FT.toLocaleString('en-US')} ft; ${altitudeFt.toLocaleString('en-US')} ft is above them.`,
      'altitudeFt',
    );
  }
  const index = bands.findIndex((band) => altitudeFt <= (band.toFt ?? MAX_TABLE_ALTITUDE_FT));
  return index === -1 ? bands.length - 1 : index;
}

/** Boiling-water processing minutes for a product, jar size and altitude, from its Guide 6 table. */
export function processingTime({ product, jar, altitudeFt }: ProcessingTimeInput): ProcessingTimeResult {
  const found = getProduct(product);
  const size = checkChoice(jar, JAR_SIZES, 'jar', 'a jar size');
  const band = altitudeBandIndex(altitudeFt, found.bands);
  const row = found.times[size];
  if (!row) {
    throw outsideTable(`The published table for ${found.name.toLowerCase()} gives ${found.jars.join(' and ')} jars only, not ${size} jars.`, 'jar');
  }
  const { fromFt, toFt } = found.bands[band];
  return {
    minutes: row[band],
    method: 'boiling-water',
    altitudeBand: { fromFt, toFt },
    source: found.source,
    ...(found.lowTemperaturePasteurization ? { lowTemperaturePasteurization: { waterTempF: [180, 185] as [180, 185], minutes: 30 as const } } : {}),
    ...(row[band] < STERILIZE_BELOW_MINUTES ? { sterilizeJars: sterilizeJarsFor(row[band], altitudeFt) } : {}),
  };
}

/** True when the minutes a learner processed for are at least the table's minutes. */
export function isProcessedLongEnough(input: ProcessingTimeInput & { processedMinutes: number }): boolean {
  const processed = checkNumber(input.processedMinutes, RULES.processedMinutes);
  return processed >= processingTime(input).minutes;
}
