import { describe, expect, it } from 'vitest';
import { crispingPlan, type CalciumChloridePlan, type LimePlan } from './crisping';

describe('crispingPlan: calcium chloride', () => {
  // Calcium chloride label directions: a rounded 1/8 tsp per pint, 1/4 tsp per quart (secondary source).
  it('doses per jar and per batch', () => {
    const pints = crispingPlan({ agent: 'calcium-chloride', jar: 'pint', jars: 7 }) as CalciumChloridePlan;
    expect(pints.perJarTsp).toBe(0.125);
    expect(pints.totalTsp).toBeCloseTo(0.875, 12);
    const quarts = crispingPlan({ agent: 'calcium-chloride', jar: 'quart', jars: 7 }) as CalciumChloridePlan;
    expect(quarts.perJarTsp).toBe(0.25);
    expect(quarts.totalTsp).toBe(1.75);
    expect(quarts.cautions.join(' ')).toMatch(/does not change the acidity/);
  });

  it('answers outside-table for half-pints, which the directions do not cover', () => {
    expect(() => crispingPlan({ agent: 'calcium-chloride', jar: 'half-pint', jars: 4 })).toThrow(/pint and quart jars only.*local extension office/);
  });
});

describe('crispingPlan: pickling lime', () => {
  // USDA Complete Guide to Home Canning, rev. 2015, Guide 6:19, bread-and-butter pickles, variation for
  // firmer pickles (read in the Michigan State University Extension reproduction): "Mix 1 cup pickling
  // lime and 1/2 cup salt to 1 gallon water in a 2- to 3-gallon crock or enamelware container"; soak
  // 12–24 h, rinse and resoak 1 h in fresh cold water, twice more. The recipe: 6 lb cucumbers, about 8 pints.
  it('gives the lime water of the guide, salt included, and its soak and rinse schedule', () => {
    const plan = crispingPlan({ agent: 'pickling-lime', jar: 'pint', jars: 8 }) as LimePlan;
    expect(plan).toMatchObject({ recipe: 'bread-and-butter-pickles', recipes: 1, limeCups: 1, saltCups: 0.5, waterGallons: 1, soakHours: [12, 24], rinses: 3 });
    expect(plan.source).toContain('1 cup pickling lime and 1/2 cup salt per gallon of water');
    expect(plan.cautions.join(' ')).toMatch(/2- to 3-gallon crock or enamelware/);
    expect(plan.cautions.join(' ')).toMatch(/three times/);
    expect(plan.cautions.join(' ')).toMatch(/dust/);
    expect(plan.cautions.join(' ')).toMatch(/bread-and-butter pickles only/);
  });

  it("makes lime water by whole recipes of the tested bread-and-butter pickles, never by a fraction of the guide's gallon", () => {
    // 9 quarts = 18 pints: three recipes of about 8 pints, three gallons.
    expect(crispingPlan({ agent: 'pickling-lime', jar: 'quart', jars: 9 })).toMatchObject({ recipes: 3, limeCups: 3, saltCups: 1.5, waterGallons: 3 });
    expect(crispingPlan({ agent: 'pickling-lime', jar: 'pint', jars: 1 })).toMatchObject({ recipes: 1, limeCups: 1, saltCups: 0.5, waterGallons: 1 });
  });

  it('answers outside-table for a jar size the bread-and-butter recipe does not use', () => {
    expect(() => crispingPlan({ agent: 'pickling-lime', jar: 'half-pint', jars: 8 })).toThrow(
      /bread-and-butter pickles, which is canned in pint and quart jars only.*local extension office/,
    );
  });

  it('refuses bad input naming the parameter', () => {
    expect(() => crispingPlan({ agent: 'alum', jar: 'pint', jars: 1 })).toThrow(/Choose a crisping agent/);
    expect(() => crispingPlan({ agent: 'pickling-lime', jar: 'pint', jars: 0 })).toThrow('The number of jars must be at least 1.');
    expect(() => crispingPlan({ agent: 'pickling-lime', jar: 'pint', jars: 2.5 })).toThrow('The number of jars must be a whole number.');
  });
});
