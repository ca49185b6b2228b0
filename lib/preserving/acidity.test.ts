import { describe, expect, it } from 'vitest';
import {
  ACETIC_ACID_MOLAR_MASS,
  ACETIC_ACID_PKA,
  MAX_TABLE_VINEGAR_ACIDITY_PCT,
  MIN_FOOD_VINEGAR_ACIDITY_PCT,
  MIN_VINEGAR_ACIDITY_PCT,
  PH_CAUTION,
  aceticAcidPh,
  brineAcidity,
} from './acidity';
import { PRODUCTS, PRODUCT_IDS, WEAKEST_TESTED, testedAceticAcidPct } from './products';
import { mlPer } from './units';

describe('acetic acid constants', () => {
  it('uses the published pKa and molar mass', () => {
    // CRC Handbook of Chemistry and Physics, "Dissociation constants of organic acids in aqueous
    // solution": acetic acid pKa 4.756 at 25 °C.
    expect(ACETIC_ACID_PKA).toBe(4.756);
    // IUPAC standard atomic weights (C 12.011, H 1.008, O 15.999): C2H4O2 = 60.052 g/mol.
    expect(ACETIC_ACID_MOLAR_MASS).toBeCloseTo(2 * 12.011 + 4 * 1.008 + 2 * 15.999, 3);
    // USDA Complete Guide to Home Canning, rev. 2015, Guide 6: vinegar of 5 % acidity.
    expect(MIN_VINEGAR_ACIDITY_PCT).toBe(5);
  });

  it('reproduces the textbook pH of 0.10 M acetic acid, 2.88 (general-chemistry worked example, value from memory)', () => {
    expect(aceticAcidPh(0.1)).toBeCloseTo(2.88, 2);
  });

  it('agrees with the half-(pKa − log c) approximation where it holds (c ≫ Ka)', () => {
    for (const c of [0.3, 0.5, 0.8]) expect(Math.abs(aceticAcidPh(c) - 0.5 * (ACETIC_ACID_PKA - Math.log10(c)))).toBeLessThan(0.005);
  });
});

describe('brineAcidity', () => {
  // Computed values (from the pKa and molar mass above with the exact weak-acid quadratic); the
  // mixes themselves are those of USDA Guide 6 recipes.
  it('straight 5 % vinegar: 5 g/100 mL, 0.8326 M, pH 2.419', () => {
    const r = brineAcidity({ vinegarMl: 1000, vinegarAcidityPct: 5, waterMl: 0 });
    expect(r.aceticAcidPct).toBeCloseTo(5, 10);
    expect(r.vinegarShare).toBe(1);
    expect(r.estimatedPh).toBeCloseTo(2.419, 3);
    expect(r.warnings).toEqual([]);
  });

  it('2 : 1 and 1 : 1 vinegar to water: pH 2.507 and 2.570', () => {
    expect(brineAcidity({ vinegarMl: 200, vinegarAcidityPct: 5, waterMl: 100 }).estimatedPh).toBeCloseTo(2.507, 3);
    const half = brineAcidity({ vinegarMl: 500, vinegarAcidityPct: 5, waterMl: 500 });
    expect(half.aceticAcidPct).toBeCloseTo(2.5, 10);
    expect(half.vinegarShare).toBe(0.5);
    expect(half.estimatedPh).toBeCloseTo(2.57, 3);
  });

  it('the quick fresh-pack dill solution of USDA Guide 6 (1 1/2 qt vinegar, 2 qt water): 2.14 %, pH 2.603', () => {
    const r = brineAcidity({ vinegarMl: 6 * mlPer('cup'), vinegarAcidityPct: 5, waterMl: 8 * mlPer('cup') });
    expect(r.aceticAcidPct).toBeCloseTo(2.1429, 4);
    expect(r.vinegarShare).toBeCloseTo(6 / 14, 10);
    expect(r.estimatedPh).toBeCloseTo(2.603, 3);
  });

  it('counts other liquids in the volume but not in the acid', () => {
    const r = brineAcidity({ vinegarMl: 500, vinegarAcidityPct: 5, waterMl: 250, otherMl: 250 });
    expect(r.aceticAcidPct).toBeCloseTo(2.5, 10);
    expect(r.vinegarShare).toBe(0.5);
  });

  it('dilutes the acid with the produce water and gives no second pH for it', () => {
    // 1 L of 1 : 1 brine over 1 kg of cucumbers at 95 % water → 25 g acid in 1.95 L.
    const r = brineAcidity({ vinegarMl: 500, vinegarAcidityPct: 5, waterMl: 500, produceG: 1000, produceWaterPct: 95 });
    expect(r.equilibratedAcidityPct).toBeCloseTo((25 / 1950) * 100, 10);
    expect(r).not.toHaveProperty('equilibratedPh');
    expect(r.warnings.join(' ')).toMatch(/buffers/);
    // The default produce water is the cucumber figure (about 95 %; USDA FoodData Central SR Legacy, from memory).
    expect(brineAcidity({ vinegarMl: 500, vinegarAcidityPct: 5, waterMl: 500, produceG: 1000 }).equilibratedAcidityPct).toBeCloseTo(
      r.equilibratedAcidityPct!,
      10,
    );
  });

  it('presents the pH as the liquid before the produce, with the caution beside it', () => {
    const r = brineAcidity({ vinegarMl: 500, vinegarAcidityPct: 5, waterMl: 500 });
    expect(r.phCaution).toBe(PH_CAUTION);
    expect(r.phCaution).toMatch(/before the produce goes in/);
    expect(r.phCaution).toMatch(/tested recipe, or a calibrated pH meter/);
  });

  it('warns about vinegar below 5 % (USDA Guide 6) and below the 4 % of a food-vinegar label (FDA CPG Sec. 525.825)', () => {
    const four = brineAcidity({ vinegarMl: 500, vinegarAcidityPct: 4, waterMl: 0 }).warnings;
    expect(four[0]).toMatch(/below 5% acidity/);
    expect(four.join(' ')).not.toMatch(/labelled below 4%/);
    expect(MIN_FOOD_VINEGAR_ACIDITY_PCT).toBe(4);
    expect(brineAcidity({ vinegarMl: 500, vinegarAcidityPct: 3, waterMl: 0 }).warnings[0]).toMatch(
      /No food vinegar is labelled below 4% acidity \(FDA Compliance Policy Guide Sec. 525.825\)/,
    );
  });

  it('warns about vinegar above 7 % (common practice: table and pickling vinegars are sold at 4 % to about 7 %)', () => {
    expect(MAX_TABLE_VINEGAR_ACIDITY_PCT).toBe(7);
    expect(brineAcidity({ vinegarMl: 500, vinegarAcidityPct: 7, waterMl: 500, product: 'dilly-beans' }).warnings).toEqual([]);
    const strong = brineAcidity({ vinegarMl: 500, vinegarAcidityPct: 7.5, waterMl: 500 });
    expect(strong.warnings.join(' ')).toMatch(/above 7% acidity/);
    expect(brineAcidity({ vinegarMl: 100, vinegarAcidityPct: 30, waterMl: 500 }).warnings.join(' ')).toMatch(/cleaning or weeds/);
  });
});

describe('brineAcidity against the tested liquids', () => {
  const CUP = mlPer('cup');
  // The two mixes of the review that got no warning: 100 mL and 200 mL of 5 % vinegar in 1,000 mL water.
  it('warns below the weakest tested liquid when no product is chosen, naming it (quick fresh-pack dill, 2.14 %)', () => {
    // USDA Complete Guide to Home Canning (rev. 2015), Guide 6, quick fresh-pack dill pickles: 1 1/2 qt
    // vinegar (5 %) to 2 qt water → 5 × 6/14 = 2.14 % (computed from the recipe).
    expect(WEAKEST_TESTED.product.id).toBe('fresh-pack-dill-pickles');
    expect(WEAKEST_TESTED.aceticAcidPct).toBeCloseTo(2.142857, 6);
    const tenth = brineAcidity({ vinegarMl: 100, vinegarAcidityPct: 5, waterMl: 1000 });
    expect(tenth.aceticAcidPct).toBeCloseTo(0.4545, 4);
    expect(tenth.belowTested).toBe(true);
    expect(tenth.tested).toMatchObject({ product: 'fresh-pack-dill-pickles', weakest: true, sugarCountsInVolume: false });
    expect(tenth.warnings.join(' ')).toContain(
      '0.45% acetic acid, weaker than the weakest tested liquid Brinewright knows, that of quick fresh-pack dill pickles (2.14%)',
    );
    const fifth = brineAcidity({ vinegarMl: 200, vinegarAcidityPct: 5, waterMl: 1000 });
    expect(fifth.aceticAcidPct).toBeCloseTo(0.8333, 4);
    expect(fifth.warnings.join(' ')).toMatch(/0.83% acetic acid, weaker than the weakest tested liquid/);
    // The tested liquid itself is not below it.
    expect(brineAcidity({ vinegarMl: 6 * CUP, vinegarAcidityPct: 5, waterMl: 8 * CUP }).belowTested).toBe(false);
  });

  it("compares with the chosen product's own tested liquid (USDA Guide 6 recipes)", () => {
    // Hot peppers: 5 cups vinegar (5 %), 1 cup water → 4.17 %; a 2.5 % mix warns.
    const peppers = brineAcidity({ vinegarMl: 500, vinegarAcidityPct: 5, waterMl: 500, product: 'pickled-hot-peppers' });
    expect(peppers.tested.aceticAcidPct).toBeCloseTo(4.1667, 4);
    expect(peppers.warnings.join(' ')).toMatch(/2.5% acetic acid, weaker than the tested liquid of pickled hot peppers \(4.17%\)/);
    // Beets: 4 cups vinegar, 2 cups water → 3.33 % (from memory); 2.27 % warns.
    const beets = brineAcidity({ vinegarMl: 1000, vinegarAcidityPct: 5, waterMl: 1200, product: 'pickled-beets' });
    expect(beets.aceticAcidPct).toBeCloseTo(2.2727, 4);
    expect(beets.tested.aceticAcidPct).toBeCloseTo(3.3333, 4);
    expect(beets.belowTested).toBe(true);
    // Bread-and-butter: 4 cups vinegar, 4 1/2 cups sugar, no water → 5 % (sugar not counted in the volume);
    // the fresh-pack dill liquid (2.14 %) warns there.
    const bnb = brineAcidity({ vinegarMl: 6 * CUP, vinegarAcidityPct: 5, waterMl: 8 * CUP, product: 'bread-and-butter-pickles' });
    expect(bnb.tested.aceticAcidPct).toBe(5);
    expect(bnb.warnings.join(' ')).toMatch(/weaker than the tested liquid of bread-and-butter pickles \(5%\)/);
    expect(bnb.warnings.join(' ')).toContain('4 cups vinegar (5 %), 4 1/2 cups sugar, no water');
  });

  it("gives no below-tested warning for any product's own tested liquid, and warns 0.01 % below it", () => {
    for (const id of PRODUCT_IDS) {
      const l = PRODUCTS[id].testedLiquid;
      const own = brineAcidity({ vinegarMl: l.vinegarCups * CUP, vinegarAcidityPct: l.vinegarAcidityPct, waterMl: l.waterCups * CUP, product: id });
      expect(own.belowTested, id).toBe(false);
      expect(own.aceticAcidPct).toBeCloseTo(testedAceticAcidPct(l), 10);
      // 1.5 % more water lowers every liquid here by at least 0.01 % at the precision shown.
      const thinner = brineAcidity({
        vinegarMl: l.vinegarCups * CUP,
        vinegarAcidityPct: 5,
        waterMl: l.waterCups * CUP + (l.vinegarCups + l.waterCups) * CUP * 0.015,
        product: id,
      });
      if (id !== 'fermented-dill-pickles') expect(thinner.belowTested, id).toBe(true);
    }
  });

  it('sends fermented pickles to the salt by weight, since their acid comes from the fermentation', () => {
    const r = brineAcidity({ vinegarMl: 0.25 * CUP, vinegarAcidityPct: 5, waterMl: 8 * CUP, product: 'fermented-dill-pickles' });
    expect(r.warnings.join(' ')).toMatch(/salt by weight/);
  });

  it('answers not-found for an unknown product', () => {
    expect(() => brineAcidity({ vinegarMl: 1, vinegarAcidityPct: 5, waterMl: 1, product: 'pickled-okra' })).toThrow(
      /There is no product called "pickled-okra"/,
    );
  });

  it('refuses negative or missing volumes naming the parameter', () => {
    expect(() => brineAcidity({ vinegarMl: -1, vinegarAcidityPct: 5, waterMl: 0 })).toThrow('The vinegar in mL cannot be negative.');
    expect(() => brineAcidity({ vinegarMl: 0, vinegarAcidityPct: 5, waterMl: 0 })).toThrow(/add up to 0 mL/);
    expect(() => brineAcidity({ vinegarMl: 10, vinegarAcidityPct: 120, waterMl: 0 })).toThrow('The vinegar acidity in % must be at most 100.');
    expect(() => brineAcidity({ vinegarMl: 10, vinegarAcidityPct: 5, waterMl: Number.NaN })).toThrow('Enter the water in mL as a number.');
  });
});
