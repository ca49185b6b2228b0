import { describe, expect, it } from 'vitest';
import { SUGARS, SUGAR_KINDS, sugarToGrams } from './sugar';
import { mlPer } from './units';

describe('sugarToGrams', () => {
  it('weighs a cup of each sugar by the USDA food-composition portions (FoodData Central SR Legacy; from memory)', () => {
    // "Sugars, granulated": 1 cup = 200 g; "Sugars, brown": 1 cup packed = 220 g.
    expect(SUGAR_KINDS).toEqual(['granulated', 'brown-packed']);
    expect(sugarToGrams({ sugar: 'granulated', amount: 1, unit: 'cup' }).grams).toBeCloseTo(200, 9);
    expect(sugarToGrams({ sugar: 'brown-packed', amount: 1, unit: 'cup' }).grams).toBeCloseTo(220, 9);
  });

  it("gives about 4.2 g for a teaspoon of granulated sugar, the same table's teaspoon portion (from memory), ±2 %", () => {
    const grams = sugarToGrams({ sugar: 'granulated', amount: 1, unit: 'tsp' }).grams;
    expect(grams).toBeGreaterThan(4.2 * 0.98);
    expect(grams).toBeLessThan(4.2 * 1.02);
  });

  it('passes weights straight through (exact: 1 lb = 453.59237 g)', () => {
    expect(sugarToGrams({ sugar: 'brown-packed', amount: 2, unit: 'lb' }).grams).toBeCloseTo(907.18474, 6);
  });

  it('gives the sugar share of the bread-and-butter syrup: 4 1/2 cups sugar in 4 cups vinegar', () => {
    // USDA Complete Guide to Home Canning, rev. 2015, Guide 6, "Bread-and-butter pickles":
    // 4-1/2 cups sugar and 4 cups 5 % vinegar (from memory, the amounts the batch planner also uses).
    // 900 g ÷ (900 g + 946.35 g) = 48.7 % by weight, vinegar taken as 1 g/mL.
    const r = sugarToGrams({ sugar: 'granulated', amount: 4.5, unit: 'cup', liquidMl: 4 * mlPer('cup') });
    expect(r.grams).toBeCloseTo(900, 9);
    expect(r.syrupPct).toBeCloseTo((900 / (900 + 4 * 236.5882365)) * 100, 9);
    expect(r.syrupPct).toBeGreaterThan(48.7);
    expect(r.syrupPct).toBeLessThan(48.8);
  });

  it('says every kind of sugar is for flavour, not acidity', () => {
    for (const kind of SUGAR_KINDS) expect(SUGARS[kind].why.length).toBeGreaterThan(40);
    expect(SUGARS.granulated.why).toMatch(/vinegar/);
  });

  it('refuses unknown sugars, negative amounts and units that are not volume or weight', () => {
    expect(() => sugarToGrams({ sugar: 'maple', amount: 1, unit: 'cup' })).toThrow(/Choose a kind of sugar/);
    expect(() => sugarToGrams({ sugar: 'granulated', amount: -1, unit: 'cup' })).toThrow(/amount of sugar/);
    expect(() => sugarToGrams({ sugar: 'granulated', amount: 1, unit: 'ft' })).toThrow(/unit for the sugar/);
    expect(() => sugarToGrams({ sugar: 'granulated', amount: 0, unit: 'cup', liquidMl: 0 })).toThrow(/both are 0/);
  });
});

describe('how sure a cupful is', () => {
  it('says whether the grams are exact (by weight) or approximate (by cup), with the source of the figure', () => {
    expect(sugarToGrams({ sugar: 'granulated', amount: 1, unit: 'cup' })).toMatchObject({ byWeight: false, source: SUGARS.granulated.gPerCupSource });
    expect(sugarToGrams({ sugar: 'granulated', amount: 200, unit: 'g' })).toMatchObject({ byWeight: true, grams: 200 });
  });
});
