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

/** Index of the Guide 6 altitude band; above 1,000 ft (even by a fraction) is the next band. */
export function altitudeBandIndex(altitudeFt: number): 0 | 1 | 2 {
  checkNumber(altitudeFt, ALTITUDE_RULE);
  if (altitudeFt > MAX_TABLE_ALTITUDE_FT) {
    throw outsideTable(`The published processing tables go up to ${MAX_TABLE_ALTITUDE_FT.toLocaleString('en-US')} ft; ${altitudeFt.toLocaleString('en-US')} ft is above them.`, 'altitudeFt');
  }
  if (altitudeFt <= ALTITUDE_BANDS[0].toFt) return 0;
  if (altitudeFt <= ALTITUDE_BANDS[1].toFt) return 1;
  return 2;
}

/** Boiling-water processing minutes for a product, jar size and altitude, from its Guide 6 table. */
export function processingTime({ product, jar, altitudeFt }: ProcessingTimeInput): ProcessingTimeResult {
  const found = getProduct(product);
  const size = checkChoice(jar, JAR_SIZES, 'jar', 'a jar size');
  const band = altitudeBandIndex(altitudeFt);
  const row = found.times[size];
  if (!row) {
    throw outsideTable(`The published table for ${found.name.toLowerCase()} gives ${found.jars.join(' and ')} jars only, not ${size} jars.`, 'jar');
  }
  const { fromFt, toFt } = ALTITUDE_BANDS[band];
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

