import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import type { PracticalDetails } from '@/lib/validations/practical';
import { CHECK_INPUTS, checkPractical, computeExpectations, MIN_BRINE_ACETIC_ACID_PCT } from './checks';

// A batch that follows the USDA quick fresh-pack dill recipe at sea level: the values below are
// from USDA Complete Guide to Home Canning (AIB 539, rev. 2015), Guide 6, "Quick fresh-pack dill
// pickles" (pints 10 min at 0–1,000 ft, 15 min at 1,001–6,000 ft, 20 min above 6,000 ft; quarts 15 /
// 20 / 25; ½-inch headspace; 1½ qt of 5 % vinegar to 2 qt water).
const QUART_ML = 946.352946; // NIST Handbook 44, Appendix C (exact by definition)
const good: PracticalDetails = {
  product: 'fresh-pack-dill-pickles',
  recipeTitle: 'Quick fresh-pack dill pickles',
  recipeSource: 'USDA Complete Guide to Home Canning, Guide 6',
  jar: 'pint',
  jars: 7,
  pack: 'raw',
  vinegarAcidityPct: 5,
  vinegarMl: 1.5 * QUART_ML,
  waterMl: 2 * QUART_ML,
  headspaceIn: 0.5,
  method: 'boiling-water',
  altitudeFt: 500,
  minutes: 10,
  batchDate: '2026-11-20',
  sealedJars: 7,
  unsealedJars: 0,
  notes: '',
};

const checks = (overrides: Partial<PracticalDetails>) => checkPractical({ ...good, ...overrides }).map((f) => f.check);

describe('CHECK_INPUTS', () => {
  it('names exactly the fields checkPractical reads (the practical form lists the empty ones)', () => {
    const source = fs.readFileSync(path.join(__dirname, 'checks.ts'), 'utf8');
    const body = source.slice(source.indexOf('export function checkPractical('));
    const read = new Set([...body.matchAll(/\binput\.(\w+)/g)].map((m) => m[1]));
    expect([...read].sort()).toEqual([...CHECK_INPUTS].sort());
  });
});

describe('checkPractical', () => {
  it('raises no flag for a batch that follows the published recipe and table', () => {
    expect(checkPractical(good)).toEqual([]);
  });

  it('flags a process time shorter than the published time for the altitude band', () => {
    // USDA Guide 6 quick fresh-pack dill, pints: 15 min at 1,001–6,000 ft.
    const flags = checkPractical({ ...good, altitudeFt: 5000, minutes: 10 });
    expect(flags).toHaveLength(1);
    expect(flags[0]).toMatchObject({ check: 'processing-time', expected: '15 min', actual: '10 min' });
    expect(flags[0].message).toContain('1,001–6,000 ft');
    expect(flags[0].source).toMatch(/Guide 6/);
    // The published time itself passes, and so does a longer one.
    expect(checks({ altitudeFt: 5000, minutes: 15 })).toEqual([]);
    expect(checks({ altitudeFt: 5000, minutes: 20 })).toEqual([]);
  });

  it('uses the band edges of the published table: 1,000 ft is the lowest band, 6,001 ft the highest', () => {
    // USDA Guide 6 quick fresh-pack dill, quarts: 15 / 20 / 25 min.
    expect(checks({ jar: 'quart', altitudeFt: 1000, minutes: 15 })).toEqual([]);
    expect(checks({ jar: 'quart', altitudeFt: 1001, minutes: 15 })).toEqual(['processing-time']);
    expect(checks({ jar: 'quart', altitudeFt: 6001, minutes: 20 })).toEqual(['processing-time']);
    expect(checks({ jar: 'quart', altitudeFt: 6001, minutes: 25 })).toEqual([]);
  });

  it('flags a jar size the product table does not give, without guessing a time', () => {
    // Guide 6 gives quick fresh-pack dills in pints and quarts only.
    const flags = checkPractical({ ...good, jar: 'half-pint' });
    expect(flags.map((f) => f.check)).toEqual(['processing-time']);
    expect(flags[0].message).toMatch(/no published boiling-water time/);
    expect(flags[0].expected).toBeUndefined();
  });

  it('accepts low-temperature pasteurization for 30 minutes only where the guide allows it', () => {
    // Guide 6: 180–185 °F for 30 minutes for quick fresh-pack dills; not published for pickled beets.
    expect(checks({ method: 'low-temperature-pasteurization', minutes: 30 })).toEqual([]);
    const short = checkPractical({ ...good, method: 'low-temperature-pasteurization', minutes: 20 });
    expect(short.map((f) => f.check)).toEqual(['processing-time']);
    expect(short[0].expected).toBe('30 min at 180–185 °F');
    expect(checks({ product: 'pickled-beets', pack: 'hot', method: 'low-temperature-pasteurization', minutes: 30, vinegarMl: 2 * 236.6, waterMl: 236.6 })).toEqual([
      'processing-method',
    ]);
  });

  it('flags headspace beyond 1/8 inch of the recommended 1/2 inch either way', () => {
    // USDA Guide 6 dill pickles: ½-inch headspace; the ⅛-inch tolerance is common practice (a headspace tool's finest mark).
    expect(checks({ headspaceIn: 0.25 })).toEqual(['headspace']);
    expect(checks({ headspaceIn: 1 })).toEqual(['headspace']);
    expect(checks({ headspaceIn: 0.375 })).toEqual([]);
    expect(checks({ headspaceIn: 0.625 })).toEqual([]);
    const [flag] = checkPractical({ ...good, headspaceIn: 0.25 });
    expect(flag.message).toMatch(/less than the recommended 0.5 in/);
  });

  it('flags vinegar below 5 % acidity', () => {
    // USDA Guide 6, "Ingredients": use vinegar of 5 percent acidity.
    const flags = checkPractical({ ...good, vinegarAcidityPct: 4 });
    expect(flags.map((f) => f.check)).toContain('vinegar-acidity');
    expect(flags.find((f) => f.check === 'vinegar-acidity')).toMatchObject({ expected: '≥ 5 %', actual: '4 %' });
    expect(checks({ vinegarAcidityPct: 5 })).toEqual([]);
  });

  it('flags a brine more dilute than the weakest tested recipe, and accepts that recipe itself', () => {
    // Quick fresh-pack dill liquid: 6 cups 5 % vinegar in 14 cups = 2.142857… % acetic acid (computed from USDA Guide 6).
    expect(MIN_BRINE_ACETIC_ACID_PCT).toBeCloseTo(2.142857, 6);
    expect(checks({})).toEqual([]);
    // One more cup of water than the recipe: 5 × 6 / 15 = 2.0 %.
    const flags = checkPractical({ ...good, vinegarMl: 6 * 236.5882365, waterMl: 9 * 236.5882365 });
    expect(flags.map((f) => f.check)).toEqual(['dilution']);
    expect(flags[0].actual).toMatch(/^2 % acetic acid \(40 % of the liquid is vinegar\)/);
    // Dilly beans, 1:1 (2½ cups vinegar, 2½ cups water in USDA Guide 6 from memory): 2.5 %, no flag.
    expect(checks({ product: 'dilly-beans', vinegarMl: 591.5, waterMl: 591.5, minutes: 5 })).toEqual([]);
  });

  it('does not apply the dilution floor to fermented pickles, whose acid comes from fermenting', () => {
    // USDA Guide 6 fermented dills: ¼ cup vinegar to 8 cups water in the crock.
    expect(checks({ product: 'fermented-dill-pickles', vinegarMl: 59.15, waterMl: 1892.7 })).toEqual([]);
  });

  it('flags a pack other than the tested recipe’s and jars that did not seal', () => {
    expect(checks({ pack: 'hot' })).toEqual(['pack']);
    const flags = checkPractical({ ...good, sealedJars: 5, unsealedJars: 2 });
    expect(flags.map((f) => f.check)).toEqual(['seals']);
    // USDA Complete Guide, Guide 1: reprocess an unsealed jar within 24 hours.
    expect(flags[0].message).toMatch(/within 24 hours/);
  });

  it('skips the checks whose inputs are still missing, as the form calls it while typing', () => {
    expect(checkPractical({})).toEqual([]);
    expect(checkPractical({ product: 'fresh-pack-dill-pickles', jar: 'pint', altitudeFt: 7000, method: 'boiling-water', minutes: 15 }).map((f) => f.check)).toEqual(['processing-time']);
  });
});

describe('computeExpectations', () => {
  it('gives the published numbers for the batch', () => {
    const e = computeExpectations({ ...good, altitudeFt: 7000, jar: 'quart' });
    expect(e.processing).toMatchObject({ minutes: 25, altitudeBand: { fromFt: 6001 } });
    expect(e.headspace).toEqual({ recommendedIn: 0.5 });
    expect(e.pack).toBe('raw');
    expect(e.brine?.aceticAcidPct).toBeCloseTo(2.142857, 5);
    expect(e.lowTemperaturePasteurization).toEqual({ waterTempF: [180, 185], minutes: 30 });
  });

  it('explains when the published table does not cover the altitude', () => {
    const e = computeExpectations({ ...good, altitudeFt: 11000 });
    expect(e.processing).toHaveProperty('unavailable');
    expect((e.processing as { unavailable: string }).unavailable).toMatch(/local extension office/);
  });
});
