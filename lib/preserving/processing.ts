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
};

/** Index of the altitude band in a table; a fraction of a foot above a band's top is the next band. */
export function altitudeBandIndex(altitudeFt: number, bands: readonly AltitudeBand[] = ALTITUDE_BANDS): number {
  checkNumber(altitudeFt, ALTITUDE_RULE);
  if (altitudeFt > MAX_TABLE_ALTITUDE_FT) {
    throw outsideTable(`The published processing tables go up to ${MAX_TABLE_ALTITUDE_FT.toLocaleString('en-US')} ft; ${altitudeFt.toLocaleString('en-US')} ft is above them.`, 'altitudeFt');
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
  };
}

/** True when the minutes a learner processed for are at least the table's minutes. */
export function isProcessedLongEnough(input: ProcessingTimeInput & { processedMinutes: number }): boolean {
  const processed = checkNumber(input.processedMinutes, RULES.processedMinutes);
  return processed >= processingTime(input).minutes;
}

