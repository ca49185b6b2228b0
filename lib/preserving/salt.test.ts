import { describe, expect, it } from 'vitest';
import { BY_SPOON_NOTE, SALTS, SALT_KINDS, saltForBrine, saltToGrams } from './salt';
import { mlPer } from './units';

describe('saltToGrams', () => {
  it('lists the five kinds of salt and marks only canning/pickling salt suitable', () => {
    // USDA Complete Guide to Home Canning, rev. 2015, Guide 6, "Ingredients: salt": use canning or
    // pickling salt; anti-caking agents cloud brine; flake salt varies in density (not recommended).
    expect(SALT_KINDS).toEqual(['canning', 'table', 'kosher-flake', 'kosher-coarse', 'sea-fine']);
    expect(SALT_KINDS.filter((k) => SALTS[k].suitable)).toEqual(['canning']);
    expect(saltToGrams({ salt: 'table', amount: 1, unit: 'tsp' }).why).toMatch(/cloudy/);
    expect(saltToGrams({ salt: 'kosher-flake', amount: 1, unit: 'tsp' }).why).toMatch(/density/);
  });

  it('weighs table salt by the USDA food-composition portion: 1 tsp = 6.0 g (SR Legacy; from memory), ±10 %', () => {
    const grams = saltToGrams({ salt: 'table', amount: 1, unit: 'tbsp' }).grams;
    expect(grams).toBeGreaterThan(18 * 0.9);
    expect(grams).toBeLessThan(18 * 1.1);
  });

  it('weighs kosher flakes by the package-label portions (from memory): 1/4 tsp = 0.7 g light, 1.2 g dense', () => {
    expect(saltToGrams({ salt: 'kosher-flake', amount: 0.25, unit: 'tsp' }).grams).toBeCloseTo(0.7, 6);
    expect(saltToGrams({ salt: 'kosher-coarse', amount: 0.25, unit: 'tsp' }).grams).toBeCloseTo(1.2, 6);
  });

  it('passes weights straight through (exact: 1 oz = 28.349523125 g)', () => {
    expect(saltToGrams({ salt: 'sea-fine', amount: 2, unit: 'oz' }).grams).toBeCloseTo(56.69904625, 9);
    expect(saltToGrams({ salt: 'canning', amount: 0.1, unit: 'kg' }).grams).toBeCloseTo(100, 9);
  });

  it('gives the brine strength by weight for the USDA fermented-dill crock: 1/2 cup salt in 8 cups water', () => {
    // USDA Guide 6, "Dill pickles" (per gallon: 1/2 cup salt, 1/4 cup vinegar, 8 cups water).
    // REFERENCES.md computes about 5.6–6.9 % w/w over the range of salt densities; at 6 g/tsp
    // (24 tsp) and without the vinegar: 144 g / (144 g + 1892.7 g) = 7.07 %.
    const r = saltToGrams({ salt: 'canning', amount: 0.5, unit: 'cup', waterMl: 8 * mlPer('cup') });
    expect(r.grams).toBeCloseTo(144, 6);
    expect(r.brinePct).toBeCloseTo((144 / (144 + 8 * mlPer('cup'))) * 100, 9);
    expect(r.brinePct).toBeGreaterThan(5.5);
    expect(r.brinePct).toBeLessThan(7.5);
    expect(r.suitable).toBe(true);
  });

  it('refuses bad input naming the parameter', () => {
    expect(() => saltToGrams({ salt: 'rock', amount: 1, unit: 'tsp' })).toThrow(/Choose a kind of salt/);
    expect(() => saltToGrams({ salt: 'table', amount: -1, unit: 'tsp' })).toThrow('The amount of salt cannot be negative.');
    expect(() => saltToGrams({ salt: 'table', amount: 1, unit: 'ft' })).toThrow(/Choose a unit for the salt/);
    expect(() => saltToGrams({ salt: 'table', amount: 1, unit: 'tsp', waterMl: -3 })).toThrow('The water in mL cannot be negative.');
  });
});

describe('saltForBrine', () => {
  it('inverts the strength by weight: a 5 % brine in 1 L of water needs 52.63 g (5/95 × 1000 g)', () => {
    expect(saltForBrine({ salt: 'canning', waterMl: 1000, brinePct: 5 }).grams).toBeCloseTo(52.6316, 4);
    const back = saltToGrams({ salt: 'canning', amount: saltForBrine({ salt: 'canning', waterMl: 750, brinePct: 3.5 }).grams, unit: 'g', waterMl: 750 });
    expect(back.brinePct).toBeCloseTo(3.5, 10);
  });

  it('refuses a brine stronger than saturated salt water (about 26 % at 20 °C, CRC Handbook)', () => {
    expect(() => saltForBrine({ salt: 'canning', waterMl: 1000, brinePct: 30 })).toThrow('The brine strength in % must be at most 26.');
  });
});

describe('how sure a spoonful is', () => {
  it('gives every salt a span of grams per teaspoon and its source, and says by weight is exact', () => {
    for (const kind of SALT_KINDS) {
      const { gPerTsp, gPerTspRange, gPerTspSource } = SALTS[kind];
      expect(gPerTspRange[0]).toBeLessThanOrEqual(gPerTsp);
      expect(gPerTspRange[1]).toBeGreaterThanOrEqual(gPerTsp);
      expect(gPerTspSource).toMatch(/memory|secondhand|secondary|USDA/);
    }
    expect(BY_SPOON_NOTE).toMatch(/By weight is exact; by spoon or cup is approximate/);
  });

  it('answers a range by spoon and an exact figure by weight', () => {
    // Canning salt: no published g/tsp found; 4.6 (UW-Extension B2267, 220 g per cup, quoted secondhand) to 6 g (from memory).
    const spoon = saltToGrams({ salt: 'canning', amount: 1, unit: 'tbsp', waterMl: 1000 });
    expect(spoon.byWeight).toBe(false);
    expect(spoon.gramsRange[0]).toBeCloseTo(13.8, 10);
    expect(spoon.gramsRange[1]).toBeCloseTo(18, 10);
    expect(spoon.brinePctRange![0]).toBeCloseTo((13.8 / 1013.8) * 100, 9);
    expect(spoon.source).toBe(SALTS.canning.gPerTspSource);
    const weighed = saltToGrams({ salt: 'canning', amount: 50, unit: 'g', waterMl: 950 });
    expect(weighed).toMatchObject({ byWeight: true, gramsRange: [50, 50], brinePct: 5, brinePctRange: [5, 5] });
  });

  it('gives the teaspoons for a brine as a range too', () => {
    const r = saltForBrine({ salt: 'canning', waterMl: 950, brinePct: 5 });
    expect(r.grams).toBeCloseTo(50, 9);
    expect(r.teaspoonsRange[0]).toBeCloseTo(50 / 6, 9);
    expect(r.teaspoonsRange[1]).toBeCloseTo(50 / 4.6, 9);
  });
});
