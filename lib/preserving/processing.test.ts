import { describe, expect, it } from 'vitest';
import { LOCAL_GUIDANCE, PreservingError } from './errors';
import { STERILIZE_SOURCE, isProcessedLongEnough, processingTime, sterilizingMinutes } from './processing';

/** The altitudes tested in every band: each band's edges and a point inside. */
const BAND_POINTS: [number, 0 | 1 | 2][] = [
  [0, 0],
  [500, 0],
  [1000, 0],
  [1000.5, 1],
  [1001, 1],
  [3000, 1],
  [6000, 1],
  [6001, 2],
  [8000, 2],
  [10000, 2],
];

/**
 * Whole tables, USDA Complete Guide to Home Canning (AIB 539, rev. 2015), Guide 6, the recommended
 * process time table of each recipe (boiling-water canner; 0–1,000 / 1,001–6,000 / above 6,000 ft).
 * Checked in verbatim reproductions of the guide (1994 edition text, unchanged in the NCHFP pages of
 * the 2009/2015 revisions) unless marked.
 */
const PUBLISHED: [string, string, [number, number, number], string][] = [
  ['fresh-pack-dill-pickles', 'pint', [10, 15, 20], 'Guide 6, Quick fresh-pack dill pickles, table'],
  ['fresh-pack-dill-pickles', 'quart', [15, 20, 25], 'Guide 6, Quick fresh-pack dill pickles, table'],
  ['bread-and-butter-pickles', 'pint', [10, 15, 20], 'Guide 6, Bread-and-butter pickles, table ("pints or quarts")'],
  ['bread-and-butter-pickles', 'quart', [10, 15, 20], 'Guide 6, Bread-and-butter pickles, table ("pints or quarts")'],
  ['pickle-relish', 'half-pint', [10, 15, 20], 'Guide 6, Pickle relish, table ("half-pints or pints")'],
  ['pickle-relish', 'pint', [10, 15, 20], 'Guide 6, Pickle relish, table'],
  ['dilly-beans', 'pint', [5, 10, 15], 'Guide 6, Pickled dilly beans, table (secondary page quoting NCHFP)'],
  ['pickled-hot-peppers', 'half-pint', [10, 15, 20], 'Guide 6, Pickled hot peppers, table (raw pack)'],
  ['pickled-hot-peppers', 'pint', [10, 15, 20], 'Guide 6, Pickled hot peppers, table (raw pack)'],
  ['fermented-dill-pickles', 'pint', [10, 15, 20], 'Guide 6, Dill pickles (fermented), table'],
  ['fermented-dill-pickles', 'quart', [15, 20, 25], 'Guide 6, Dill pickles (fermented), table'],
];

const BANDS = [
  { fromFt: 0, toFt: 1000 },
  { fromFt: 1001, toFt: 6000 },
  { fromFt: 6001, toFt: 10000 },
];

describe('processingTime', () => {
  for (const [product, jar, minutes, source] of PUBLISHED) {
    it(`${product}, ${jar}: ${minutes.join(' / ')} min at every altitude band (${source})`, () => {
      for (const [altitudeFt, band] of BAND_POINTS) {
        const result = processingTime({ product, jar, altitudeFt });
        expect(result.minutes, `${altitudeFt} ft`).toBe(minutes[band]);
        expect(result.method).toBe('boiling-water');
        expect(result.altitudeBand).toEqual(BANDS[band]);
        expect(result.source).toContain('Complete Guide to Home Canning');
      }
    });
  }

  it('pickled beets, pints and quarts: 30 / 35 / 40 / 45 min on the four-band table (Guide 6, Pickled beets, table; two reproductions, one misprinting the 1,001–3,000 ft cell)', () => {
    const four: [number, number, { fromFt: number; toFt: number }][] = [
      [0, 30, { fromFt: 0, toFt: 1000 }],
      [1000, 30, { fromFt: 0, toFt: 1000 }],
      [1001, 35, { fromFt: 1001, toFt: 3000 }],
      [3000, 35, { fromFt: 1001, toFt: 3000 }],
      [3001, 40, { fromFt: 3001, toFt: 6000 }],
      [6000, 40, { fromFt: 3001, toFt: 6000 }],
      [6001, 45, { fromFt: 6001, toFt: 10000 }],
      [10000, 45, { fromFt: 6001, toFt: 10000 }],
    ];
    for (const jar of ['pint', 'quart']) {
      for (const [altitudeFt, minutes, altitudeBand] of four) {
        expect(processingTime({ product: 'pickled-beets', jar, altitudeFt }), `${jar} at ${altitudeFt} ft`).toMatchObject({ minutes, altitudeBand });
      }
    }
  });

  it('gives the low-temperature pasteurization option (180–185 °F for 30 min) where the guide allows it', () => {
    // USDA Complete Guide, rev. 2015, Guide 6, "Low-temperature pasteurization treatment".
    expect(processingTime({ product: 'fresh-pack-dill-pickles', jar: 'pint', altitudeFt: 0 }).lowTemperaturePasteurization).toEqual({
      waterTempF: [180, 185],
      minutes: 30,
    });
    expect(processingTime({ product: 'pickle-relish', jar: 'pint', altitudeFt: 0 }).lowTemperaturePasteurization).toBeUndefined();
  });

  it('answers outside-table, with the local-guidance sentence, for a jar the table does not cover', () => {
    const error = catchError(() => processingTime({ product: 'dilly-beans', jar: 'quart', altitudeFt: 0 }));
    expect(error.kind).toBe('outside-table');
    expect(error.param).toBe('jar');
    expect(error.message).toContain(LOCAL_GUIDANCE);
  });

  it('answers outside-table above 10,000 ft, never a guessed number', () => {
    const error = catchError(() => processingTime({ product: 'fresh-pack-dill-pickles', jar: 'pint', altitudeFt: 10001 }));
    expect(error.kind).toBe('outside-table');
    expect(error.param).toBe('altitudeFt');
    expect(error.message).toContain('local extension office');
  });

  it('refuses invalid input naming the parameter, and unknown products as not-found', () => {
    expect(catchError(() => processingTime({ product: 'fresh-pack-dill-pickles', jar: 'pint', altitudeFt: -1501 }))).toMatchObject({
      kind: 'invalid',
      param: 'altitudeFt',
      message: 'The altitude in feet must be at least -1,500.',
    });
    expect(catchError(() => processingTime({ product: 'fresh-pack-dill-pickles', jar: 'pint', altitudeFt: Number.NaN }))).toMatchObject({
      kind: 'invalid',
      param: 'altitudeFt',
    });
    expect(catchError(() => processingTime({ product: 'fresh-pack-dill-pickles', jar: 'gallon', altitudeFt: 0 }))).toMatchObject({
      kind: 'invalid',
      param: 'jar',
    });
    expect(catchError(() => processingTime({ product: 'okra', jar: 'pint', altitudeFt: 0 }))).toMatchObject({ kind: 'not-found', param: 'product' });
  });

  it('flags a process time shorter than the table for the altitude', () => {
    // Quick fresh-pack dill, quarts, 1,001–6,000 ft: 20 min (Guide 6 table).
    expect(isProcessedLongEnough({ product: 'fresh-pack-dill-pickles', jar: 'quart', altitudeFt: 4500, processedMinutes: 15 })).toBe(false);
    expect(isProcessedLongEnough({ product: 'fresh-pack-dill-pickles', jar: 'quart', altitudeFt: 4500, processedMinutes: 20 })).toBe(true);
  });
});

function catchError(fn: () => unknown): PreservingError {
  try {
    fn();
  } catch (error) {
    if (error instanceof PreservingError) return error;
    throw error;
  }
  throw new Error('expected a PreservingError');
}

describe('sterilised jars for processes under 10 minutes', () => {
  // USDA Complete Guide to Home Canning, Guide 1, "Sterilization of empty jars" (MSU Extension
  // reproduction): pickled products processed less than 10 minutes go into sterile jars; boil empty
  // jars 10 minutes below 1,000 ft, 1 additional minute for each additional 1,000 ft.
  it('boils empty jars 10 minutes up to 1,000 ft and 1 more for each further 1,000 ft or part of it', () => {
    expect(sterilizingMinutes(-200)).toBe(10);
    expect(sterilizingMinutes(1000)).toBe(10);
    expect(sterilizingMinutes(1001)).toBe(11);
    expect(sterilizingMinutes(2000)).toBe(11);
    expect(sterilizingMinutes(5200)).toBe(15);
    expect(sterilizingMinutes(10000)).toBe(19);
  });

  it('says so for dilly beans at 0–1,000 ft (5 min) and not at 10 minutes or more', () => {
    const low = processingTime({ product: 'dilly-beans', jar: 'pint', altitudeFt: 800 });
    expect(low.minutes).toBe(5);
    expect(low.sterilizeJars).toMatchObject({ boilMinutes: 10, source: STERILIZE_SOURCE });
    expect(low.sterilizeJars!.message).toMatch(/must be sterilised before filling/);
    expect(processingTime({ product: 'dilly-beans', jar: 'pint', altitudeFt: 1200 })).not.toHaveProperty('sterilizeJars');
    expect(processingTime({ product: 'fresh-pack-dill-pickles', jar: 'pint', altitudeFt: 0 })).not.toHaveProperty('sterilizeJars');
  });

  it('uses the lowest band below sea level (towns below sea level)', () => {
    expect(processingTime({ product: 'pickled-beets', jar: 'pint', altitudeFt: -200 })).toMatchObject({ minutes: 30, altitudeBand: { fromFt: 0, toFt: 1000 } });
    expect(processingTime({ product: 'dilly-beans', jar: 'pint', altitudeFt: -1400 }).sterilizeJars?.boilMinutes).toBe(10);
  });
});
