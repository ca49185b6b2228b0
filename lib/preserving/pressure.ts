import { ALTITUDE_RULE, checkChoice, checkNumber, outsideTable } from './errors';
import { MAX_TABLE_ALTITUDE_FT, type AltitudeBand } from './products';

export const GAUGES = ['weighted', 'dial'] as const;
export type Gauge = (typeof GAUGES)[number];

type Row = AltitudeBand & { pounds: number; confidence: 'verified' | 'secondary' };

/**
 * Canner pressure (psi on the gauge) by altitude. USDA Complete Guide to Home Canning (AIB 539,
 * rev. 2015), Guide 4 vegetable tables, e.g. "Snap and Italian beans", dial-gauge and
 * weighted-gauge tables (read in verbatim reproductions). The dial-gauge vegetable tables stop at
 * 8,000 ft; the 8,001–10,000 ft row (15 psi) is not in them: it is the value of a jar maker's
 * altitude chart (secondary source), shown labelled as such.
 */
export const PRESSURE_TABLE: Record<Gauge, readonly Row[]> = {
  weighted: [
    { fromFt: 0, toFt: 1000, pounds: 10, confidence: 'verified' },
    { fromFt: 1001, toFt: 10000, pounds: 15, confidence: 'verified' },
  ],
  dial: [
    { fromFt: 0, toFt: 2000, pounds: 11, confidence: 'verified' },
    { fromFt: 2001, toFt: 4000, pounds: 12, confidence: 'verified' },
    { fromFt: 4001, toFt: 6000, pounds: 13, confidence: 'verified' },
    { fromFt: 6001, toFt: 8000, pounds: 14, confidence: 'verified' },
    { fromFt: 8001, toFt: 10000, pounds: 15, confidence: 'secondary' },
  ],
};

const SOURCE = 'USDA Complete Guide to Home Canning (AIB 539, rev. 2015), Guide 4, dial-gauge and weighted-gauge pressure tables';

export type PressureResult = { pounds: number; gauge: Gauge; altitudeBand: AltitudeBand; source: string; confidence: 'verified' | 'secondary' };

/** The gauge pressure for a pressure canner at an altitude. Processing minutes do not change. */
export function pressureForAltitude({ gauge, altitudeFt }: { gauge: Gauge | string; altitudeFt: number }): PressureResult {
  const type = checkChoice(gauge, GAUGES, 'gauge', 'a gauge type');
  const altitude = checkNumber(altitudeFt, ALTITUDE_RULE);
  if (altitude > MAX_TABLE_ALTITUDE_FT) {
    throw outsideTable(
      `The published pressure tables go up to ${MAX_TABLE_ALTITUDE_FT.toLocaleString('en-US')} ft; ${altitude.toLocaleString('en-US')} ft is above them.`,
      'altitudeFt',
    );
  }
  // A fraction of a foot above a band's top belongs to the next band (the safer reading).
  const row = PRESSURE_TABLE[type].find((r) => altitude <= (r.toFt ?? Infinity))!;
  return {
    pounds: row.pounds,
    gauge: type,
    altitudeBand: { fromFt: row.fromFt, toFt: row.toFt },
    source:
      row.confidence === 'secondary' ? `${SOURCE}; the 8,001–10,000 ft dial row is not in the USDA tables (a jar maker's altitude chart, unconfirmed)` : SOURCE,
    confidence: row.confidence,
  };
}
