import { describe, expect, it } from 'vitest';
import { ACETIC_ACID_MOLAR_MASS, ACETIC_ACID_PKA, MIN_VINEGAR_ACIDITY_PCT, aceticAcidPh, brineAcidity } from './acidity';
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

  it('dilutes the acid with the produce water and says the real pH will be higher', () => {
    // 1 L of 1 : 1 brine over 1 kg of cucumbers at 95 % water → 25 g acid in 1.95 L.
    const r = brineAcidity({ vinegarMl: 500, vinegarAcidityPct: 5, waterMl: 500, produceG: 1000, produceWaterPct: 95 });
    expect(r.equilibratedAcidityPct).toBeCloseTo((25 / 1950) * 100, 10);
    expect(r.equilibratedPh).toBeGreaterThan(r.estimatedPh);
    expect(r.warnings.join(' ')).toMatch(/buffers/);
    // The default produce water is the cucumber figure (about 95 %; from memory).
    expect(brineAcidity({ vinegarMl: 500, vinegarAcidityPct: 5, waterMl: 500, produceG: 1000 }).equilibratedAcidityPct).toBeCloseTo(r.equilibratedAcidityPct!, 10);
  });

  it('warns about vinegar below 5 % and a pH above 4.6', () => {
    expect(brineAcidity({ vinegarMl: 500, vinegarAcidityPct: 4, waterMl: 500 }).warnings[0]).toMatch(/below 5% acidity/);
    // 1 mL of vinegar in 100 L of water: about 0.00005 %, pH above 4.6.
    const weak = brineAcidity({ vinegarMl: 1, vinegarAcidityPct: 5, waterMl: 100000 });
    expect(weak.estimatedPh).toBeGreaterThan(4.6);
    expect(weak.warnings.join(' ')).toMatch(/above 4.6/);
  });

  it('refuses negative or missing volumes naming the parameter', () => {
    expect(() => brineAcidity({ vinegarMl: -1, vinegarAcidityPct: 5, waterMl: 0 })).toThrow('The vinegar in mL cannot be negative.');
    expect(() => brineAcidity({ vinegarMl: 0, vinegarAcidityPct: 5, waterMl: 0 })).toThrow(/add up to 0 mL/);
    expect(() => brineAcidity({ vinegarMl: 10, vinegarAcidityPct: 120, waterMl: 0 })).toThrow('The vinegar acidity in % must be at most 100.');
    expect(() => brineAcidity({ vinegarMl: 10, vinegarAcidityPct: 5, waterMl: Number.NaN })).toThrow('Enter the water in mL as a number.');
  });
});
