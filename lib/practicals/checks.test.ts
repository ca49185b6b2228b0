import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import type { PracticalDetails } from '@/lib/validations/practical';
import { PRODUCTS, VINEGAR_PICKLED_IDS, testedAceticAcidPct, type ProductId } from '@/lib/preserving/products';
import { FERMENTED_BRINE } from '@/lib/preserving/salt';
import { mlPer } from '@/lib/preserving/units';
import { CHECK_INPUTS, checkInputsFor, checkPractical, computeExpectations } from './checks';

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
    expect(
      checks({ product: 'pickled-beets', pack: 'hot', method: 'low-temperature-pasteurization', minutes: 30, vinegarMl: 2 * 236.6, waterMl: 236.6 }),
    ).toEqual(['processing-method']);
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

  it("flags a brine more dilute than its product's tested liquid, and accepts that recipe itself", () => {
    // Quick fresh-pack dill liquid: 6 cups 5 % vinegar in 14 cups = 2.142857… % acetic acid (computed from USDA Guide 6).
    expect(testedAceticAcidPct(PRODUCTS['fresh-pack-dill-pickles'].testedLiquid)).toBeCloseTo(2.142857, 6);
    expect(checks({})).toEqual([]);
    // One more cup of water than the recipe: 5 × 6 / 15 = 2.0 %.
    const flags = checkPractical({ ...good, vinegarMl: 6 * 236.5882365, waterMl: 9 * 236.5882365 });
    expect(flags.map((f) => f.check)).toEqual(['dilution']);
    expect(flags[0].actual).toMatch(/^2 % acetic acid \(40 % of the liquid is vinegar\)/);
    // Dilly beans, 1:1 (So Easy to Preserve, 6th ed., 2 1/2 cups each): 2.5 %, no dilution flag (5 min: sterilised jars).
    expect(checks({ product: 'dilly-beans', vinegarMl: 591.5, waterMl: 591.5, minutes: 5 })).toEqual(['sterilized-jars']);
  });

  it('does not apply a vinegar floor to fermented pickles, whose acid comes from fermenting', () => {
    // USDA Guide 6 fermented dills: ¼ cup vinegar to 8 cups water in the crock.
    expect(checks({ product: 'fermented-dill-pickles', vinegarMl: 59.15, waterMl: 1892.7, jar: 'quart', minutes: 15 })).toEqual([]);
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
    expect(
      checkPractical({ product: 'fresh-pack-dill-pickles', jar: 'pint', altitudeFt: 7000, method: 'boiling-water', minutes: 15 }).map((f) => f.check),
    ).toEqual(['processing-time']);
  });
});

describe('checkPractical: each product against its own tested liquid', () => {
  const CUP = mlPer('cup'); // NIST Handbook 44, Appendix C (exact)
  // A batch of each product that follows its table at sea level, with the liquid given in cups.
  const batchOf = (id: ProductId, vinegarCups: number, waterCups: number): Partial<PracticalDetails> => {
    const p = PRODUCTS[id];
    const jar = p.jars[0];
    return { ...good, product: id, pack: p.pack, jar, minutes: Math.max(10, p.times[jar]![0]), vinegarMl: vinegarCups * CUP, waterMl: waterCups * CUP };
  };
  const dilution = (details: Partial<PracticalDetails>) => checkPractical(details).filter((f) => f.check === 'dilution');

  it.each(VINEGAR_PICKLED_IDS.map((id) => [id] as const))('%s: its tested liquid passes; 3 % more water is flagged against it, with its source', (id) => {
    const l = PRODUCTS[id].testedLiquid;
    expect(dilution(batchOf(id, l.vinegarCups, l.waterCups))).toEqual([]);
    const thinner = batchOf(id, l.vinegarCups, l.waterCups + (l.vinegarCups + l.waterCups) * 0.03);
    const [flag] = dilution(thinner);
    expect(flag).toMatchObject({ check: 'dilution', expected: `≥ ${String(Number(testedAceticAcidPct(l).toFixed(2)))} % acetic acid`, source: l.source });
    expect(flag.message).toContain(`tested liquid of ${PRODUCTS[id].name.toLowerCase()}`);
  });

  // The review's reproductions, each against USDA Complete Guide to Home Canning (rev. 2015), Guide 6.
  it('flags hot peppers at 2.5 % (tested 5 cups vinegar to 1 cup water: 4.17 %)', () => {
    expect(dilution(batchOf('pickled-hot-peppers', 1, 1))[0]).toMatchObject({
      expected: '≥ 4.17 % acetic acid',
      actual: expect.stringMatching(/^2.5 % acetic acid/),
    });
  });
  it('flags beets at 2.27 % (tested 4 cups vinegar to 2 cups water: 3.33 %; recipe from memory)', () => {
    expect(dilution(batchOf('pickled-beets', 1, 1.2))[0]).toMatchObject({
      expected: '≥ 3.33 % acetic acid',
      actual: expect.stringMatching(/^2.27 % acetic acid/),
    });
  });
  it('flags bread-and-butter at 2.14 % (tested 4 cups vinegar, no water: 5 %; its sugar not counted in the volume)', () => {
    expect(dilution(batchOf('bread-and-butter-pickles', 6, 8))[0]).toMatchObject({
      expected: '≥ 5 % acetic acid',
      actual: expect.stringMatching(/^2.14 % acetic acid/),
    });
  });

  it('with no product chosen, compares with the weakest tested liquid (quick fresh-pack dill, 2.14 %)', () => {
    const [flag] = dilution({ vinegarMl: 100, vinegarAcidityPct: 5, waterMl: 1000 });
    expect(flag).toMatchObject({ expected: '≥ 2.14 % acetic acid', source: PRODUCTS['fresh-pack-dill-pickles'].testedLiquid.source });
    expect(flag.message).toMatch(/weakest tested liquid Brinewright lists \(quick fresh-pack dill pickles\)/);
  });

  it('keeps the demo beets brine (473 mL vinegar, 237 mL water: 3.331 %) level with 3.33 % at the precision shown', () => {
    expect(dilution({ ...batchOf('pickled-beets', 2, 1), vinegarMl: 473, waterMl: 237 })).toEqual([]);
  });
});

describe('checkPractical: fermented pickles by brine strength', () => {
  // USDA Guide 6 fermented dill pickles, per gallon: 1/2 cup canning salt, 1/4 cup vinegar, 8 cups water.
  // Salt by weight computed (C) with canning salt at 4.6–6 g per tsp (no published figure; see salt.ts):
  // 110.4 g / (110.4 + 1,951.85) = 5.35 %, 144 g / (144 + 1,951.85) = 6.87 %.
  const fermented = {
    ...good,
    product: 'fermented-dill-pickles' as const,
    jar: 'quart' as const,
    minutes: 15,
    vinegarMl: 0.25 * mlPer('cup'),
    waterMl: 8 * mlPer('cup'),
  };

  it("computes the tested brine's span", () => {
    expect(FERMENTED_BRINE.minPct).toBeCloseTo(5.353, 3);
    expect(FERMENTED_BRINE.maxPct).toBeCloseTo(6.871, 3);
  });

  it('flags a weaker brine by weight and passes the tested one', () => {
    expect(checkPractical({ ...fermented, saltG: 125 })).toEqual([]);
    expect(checkPractical({ ...fermented, saltG: 110.4 })).toEqual([]);
    const [flag] = checkPractical({ ...fermented, saltG: 90 });
    expect(flag).toMatchObject({ check: 'brine-strength', expected: '≥ 5.35 % salt by weight', actual: '4.41 % salt by weight' });
    expect(flag.source).toContain('"Dill pickles" (fermented)');
    // Without the salt the check is skipped, and the form names the field.
    expect(checkPractical(fermented)).toEqual([]);
    expect(checkInputsFor('fermented-dill-pickles')).toContain('saltG');
    expect(checkInputsFor('dilly-beans')).not.toContain('saltG');
  });

  it('does not read the salt of other products', () => {
    expect(checks({ saltG: 1 })).toEqual([]);
  });
});

describe('checkPractical: processes under 10 minutes', () => {
  // USDA Complete Guide to Home Canning, Guide 1, "Sterilization of empty jars" (MSU Extension
  // reproduction): pickled products processed less than 10 minutes go into sterile jars; boil the empty
  // jars 10 minutes below 1,000 ft, 1 more minute for each further 1,000 ft.
  const dilly = { ...good, product: 'dilly-beans' as const, vinegarMl: 591.5, waterMl: 591.5, minutes: 5, altitudeFt: 500 };

  it('says the jars must be sterilised, with the minutes for the altitude', () => {
    const [flag] = checkPractical(dilly);
    expect(flag).toMatchObject({ check: 'sterilized-jars', expected: 'jars boiled empty 10 min', actual: '5 min process' });
    expect(flag.source).toMatch(/Guide 1, "Sterilization of empty jars"/);
    expect(checkPractical({ ...dilly, altitudeFt: -200 })[0]).toMatchObject({ check: 'sterilized-jars', expected: 'jars boiled empty 10 min' });
    // 10 minutes or more needs no sterilising.
    expect(checks({ ...dilly, minutes: 10 })).toEqual([]);
  });

  it('uses the lowest band below sea level', () => {
    expect(checks({ altitudeFt: -200, minutes: 10 })).toEqual([]);
    expect(computeExpectations({ ...good, altitudeFt: -200 }).processing).toMatchObject({ minutes: 10, altitudeBand: { fromFt: 0, toFt: 1000 } });
  });
});

describe('computeExpectations', () => {
  it('gives the published numbers for the batch', () => {
    const e = computeExpectations({ ...good, altitudeFt: 7000, jar: 'quart' });
    expect(e.processing).toMatchObject({ minutes: 25, altitudeBand: { fromFt: 6001 } });
    expect(e.headspace).toEqual({ recommendedIn: 0.5 });
    expect(e.pack).toBe('raw');
    expect(e.brine?.aceticAcidPct).toBeCloseTo(2.142857, 5);
    expect(e.brine).toMatchObject({ testedName: 'Quick fresh-pack dill pickles', testedAceticAcidPct: expect.closeTo(2.142857, 5) });
    expect(e.brine).not.toHaveProperty('estimatedPh');
    expect(computeExpectations({ ...good, product: 'dilly-beans', altitudeFt: 0 }).sterilizeJars).toMatchObject({ boilMinutes: 10 });
    expect(e.lowTemperaturePasteurization).toEqual({ waterTempF: [180, 185], minutes: 30 });
  });

  it('explains when the published table does not cover the altitude', () => {
    const e = computeExpectations({ ...good, altitudeFt: 11000 });
    expect(e.processing).toHaveProperty('unavailable');
    expect((e.processing as { unavailable: string }).unavailable).toMatch(/local extension office/);
  });
});
