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
  // USDA Complete Guide to Home Canning, rev. 2015, Guide 6, bread-and-butter pickles, variation for
  // firmer pickles: 1 cup lime per gallon of water, soak 12–24 h, rinse and resoak 1 h, twice more.
  it('gives the soak and rinse schedule of the guide', () => {
    const plan = crispingPlan({ agent: 'pickling-lime', jar: 'pint', jars: 8 }) as LimePlan;
    expect(plan).toMatchObject({ limeCups: 1, waterGallons: 1, soakHours: [12, 24], rinses: 3 });
    expect(plan.cautions.join(' ')).toMatch(/three times/);
    expect(plan.cautions.join(' ')).toMatch(/dust/);
  });

  it('scales the soak by half-gallons for bigger batches, keeping 1 cup per gallon', () => {
    const plan = crispingPlan({ agent: 'pickling-lime', jar: 'quart', jars: 9 }) as LimePlan; // 18 pints
    expect(plan.waterGallons).toBe(2.5);
    expect(plan.limeCups).toBe(2.5);
  });

  it('refuses bad input naming the parameter', () => {
    expect(() => crispingPlan({ agent: 'alum', jar: 'pint', jars: 1 })).toThrow(/Choose a crisping agent/);
    expect(() => crispingPlan({ agent: 'pickling-lime', jar: 'pint', jars: 0 })).toThrow('The number of jars must be at least 1.');
    expect(() => crispingPlan({ agent: 'pickling-lime', jar: 'pint', jars: 2.5 })).toThrow('The number of jars must be a whole number.');
  });
});
