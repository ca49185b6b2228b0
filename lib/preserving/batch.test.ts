import { describe, expect, it } from 'vitest';
import { EXTRA_BRINE_PCT, planBatch } from './batch';
import { PRODUCT_IDS, PRODUCTS } from './products';
import { mlPer } from './units';

describe('planBatch', () => {
  it('returns the published recipe itself at its published yield', () => {
    // USDA Complete Guide to Home Canning, rev. 2015, Guide 6, "Quick fresh-pack dill pickles":
    // 8 lb cucumbers, 1 1/2 qt vinegar, 2 qt water, 14 heads of dill, about 9 pints.
    const plan = planBatch({ product: 'fresh-pack-dill-pickles', jar: 'pint', jars: 9 });
    expect(plan.scale).toBe(1);
    expect(plan.produceLb).toBe(8);
    expect(plan.produceKg).toBeCloseTo(3.63, 2);
    expect(plan.brineMl).toBe(Math.round(14 * mlPer('cup') * 1.1));
    expect(plan.extraPct).toBe(EXTRA_BRINE_PCT);
    expect(plan.ingredients.find((i) => i.name === 'fresh dill')).toEqual({ name: 'fresh dill', amount: 14, unit: 'head' });
    expect(plan.ingredients.find((i) => i.name.startsWith('vinegar'))).toMatchObject({ amount: 6, unit: 'cup', metric: { amount: 1.42, unit: 'L' } });
  });

  it('counts a quart as two pints', () => {
    // USDA Guide 6, "Bread-and-butter pickles": 6 lb cucumbers for about 8 pints → 4 quarts.
    const plan = planBatch({ product: 'bread-and-butter-pickles', jar: 'quart', jars: 4 });
    expect(plan.produceLb).toBe(6);
    expect(plan.ingredients.find((i) => i.name === 'sugar')).toMatchObject({ amount: 4.5, unit: 'cup' });
  });

  it('scales down and rounds counted items up', () => {
    // So Easy to Preserve, 6th ed. (2014), "Pickled dilly beans": 2 lb beans, 2 1/2 cups each of water
    // and vinegar, 4 pints; one clove of garlic per pint.
    const plan = planBatch({ product: 'dilly-beans', jar: 'pint', jars: 3 });
    expect(plan.produceLb).toBe(1.5);
    expect(plan.ingredients.find((i) => i.unit === 'clove')).toMatchObject({ amount: 3 });
    expect(plan.brineMl).toBe(Math.round(5 * mlPer('cup') * 0.75 * 1.1));
  });

  it('plans every product in every jar its table covers', () => {
    for (const id of PRODUCT_IDS) {
      for (const jar of PRODUCTS[id].jars) {
        const plan = planBatch({ product: id, jar, jars: 6 });
        expect(plan.brineMl).toBeGreaterThan(0);
        expect(plan.ingredients.length).toBeGreaterThan(3);
      }
    }
    // Relish is measured by volume in the guide: no produce weight is invented for it.
    expect(planBatch({ product: 'pickle-relish', jar: 'pint', jars: 9 }).produceLb).toBeNull();
  });

  it('answers outside-table for a jar the tested recipe does not use, not-found for unknown products', () => {
    expect(() => planBatch({ product: 'dilly-beans', jar: 'quart', jars: 2 })).toThrow(/pint jars only.*local extension office/);
    expect(() => planBatch({ product: 'kimchi', jar: 'quart', jars: 2 })).toThrow(/no product/);
    expect(() => planBatch({ product: 'dilly-beans', jar: 'pint', jars: -2 })).toThrow('The number of jars cannot be negative.');
  });
});

describe('planBatch: processes under 10 minutes', () => {
  it('tells the dilly-bean planner the jars must be sterilised (5 min at 0–1,000 ft; USDA Complete Guide, Guide 1)', () => {
    const plan = planBatch({ product: 'dilly-beans', jar: 'pint', jars: 4 });
    expect(plan.sterilizeJars?.message).toMatch(/processed 5 minutes at up to 1,000 ft, under 10 minutes: there, the jars must be sterilised/);
    expect(plan.sterilizeJars?.source).toMatch(/Sterilization of empty jars/);
    expect(planBatch({ product: 'fresh-pack-dill-pickles', jar: 'pint', jars: 4 })).not.toHaveProperty('sterilizeJars');
  });
});
