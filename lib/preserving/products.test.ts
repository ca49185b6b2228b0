import { describe, expect, it } from 'vitest';
import { PreservingError } from './errors';
import { RECIPES } from './batch';
import { JAR_SIZES, PRODUCTS, PRODUCT_IDS, VINEGAR_PICKLED_IDS, WEAKEST_TESTED, getProduct, testedAceticAcidPct } from './products';

describe('products', () => {
  it('holds the seven pickled products of the shared contract', () => {
    expect(PRODUCT_IDS).toEqual([
      'fresh-pack-dill-pickles',
      'bread-and-butter-pickles',
      'pickle-relish',
      'dilly-beans',
      'pickled-beets',
      'pickled-hot-peppers',
      'fermented-dill-pickles',
    ]);
    expect(JAR_SIZES).toEqual(['half-pint', 'pint', 'quart']);
  });

  it('gives every product a table row for exactly the jars it lists, with minutes rising by band', () => {
    for (const id of PRODUCT_IDS) {
      const product = PRODUCTS[id];
      expect(Object.keys(product.times).sort()).toEqual([...product.jars].sort());
      for (const jar of product.jars) {
        const row = product.times[jar]!;
        expect(row.length).toBe(product.bands.length);
        // USDA Guide 6 pickle tables add 5 minutes per altitude band.
        for (let i = 1; i < row.length; i++) expect(row[i] - row[i - 1]).toBe(5);
      }
      expect(product.source).toMatch(/Complete Guide to Home Canning|So Easy to Preserve/);
    }
  });

  it('gives the Guide 6 pack style and headspace of each product', () => {
    // USDA Complete Guide to Home Canning, rev. 2015, Guide 6, each recipe's process-time table
    // ("Style of pack") and procedure ("leaving 1/2-inch headspace").
    expect(Object.fromEntries(PRODUCT_IDS.map((id) => [id, [PRODUCTS[id].pack, PRODUCTS[id].headspaceIn]]))).toEqual({
      'fresh-pack-dill-pickles': ['raw', 0.5],
      'bread-and-butter-pickles': ['hot', 0.5],
      'pickle-relish': ['hot', 0.5],
      'dilly-beans': ['raw', 0.5],
      'pickled-beets': ['hot', 0.5],
      'pickled-hot-peppers': ['raw', 0.5],
      'fermented-dill-pickles': ['raw', 0.5],
    });
  });

  it('labels the rows checked only on secondary pages, and uses the four-band table for beets', () => {
    expect(PRODUCT_IDS.filter((id) => PRODUCTS[id].confidence !== 'verified')).toEqual(['dilly-beans', 'pickled-beets']);
    expect(PRODUCTS['pickled-beets'].bands.map((b) => b.fromFt)).toEqual([0, 1001, 3001, 6001]);
  });

  it('allows low-temperature pasteurization only for the cucumber pickles the guide allows it for', () => {
    // USDA Complete Guide, rev. 2015, Guide 6, "Low-temperature pasteurization treatment" and the
    // bread-and-butter recipe ("or use low-temperature pasteurization treatment").
    const allowed = PRODUCT_IDS.filter((id) => PRODUCTS[id].lowTemperaturePasteurization);
    expect(allowed).toEqual(['fresh-pack-dill-pickles', 'bread-and-butter-pickles', 'fermented-dill-pickles']);
  });

  it('throws not-found for an unknown product', () => {
    expect(getProduct('dilly-beans').name).toBe('Pickled dilly beans');
    try {
      getProduct('pickled-okra');
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(PreservingError);
      expect((error as PreservingError).kind).toBe('not-found');
      expect((error as PreservingError).param).toBe('product');
    }
  });
});

describe('tested liquids', () => {
  // USDA Complete Guide to Home Canning (rev. 2015), Guide 6; acetic acid computed as vinegar acid over
  // vinegar + water (dissolved sugar not counted in the volume).
  it.each([
    ['fresh-pack-dill-pickles', 2.142857, 'Guide 6:20, 1 1/2 qt vinegar to 2 qt water (MSU Extension reproduction)'],
    ['bread-and-butter-pickles', 5, 'Guide 6:19, 4 cups vinegar, 4 1/2 cups sugar, no water (MSU Extension reproduction)'],
    ['pickle-relish', 5, '6 cups vinegar, no water (from memory)'],
    ['dilly-beans', 2.5, 'equal parts vinegar and water (So Easy to Preserve, 6th ed., via University of Minnesota Extension)'],
    ['pickled-beets', 3.333333, '4 cups vinegar to 2 cups water (from memory)'],
    ['pickled-hot-peppers', 4.166667, '5 cups vinegar to 1 cup water (secondary pages quoting NCHFP)'],
    ['fermented-dill-pickles', 0.151515, '1/4 cup vinegar to 8 cups water per gallon (its acid comes from fermenting)'],
  ] as const)('%s: %s per cent acetic acid (%s)', (id, pct, _source) => {
    const l = PRODUCTS[id].testedLiquid;
    expect(testedAceticAcidPct(l)).toBeCloseTo(pct, 5);
    expect(l.vinegarAcidityPct).toBe(5);
    expect(l.sugarCountsInVolume).toBe(false);
    expect(l.source.length).toBeGreaterThan(20);
  });

  it('agrees with the liquids the batch planner scales', () => {
    for (const id of PRODUCT_IDS) {
      const brine = RECIPES[id].ingredients.filter((i) => i.brine);
      const vinegar = brine.filter((i) => /vinegar/.test(i.name)).reduce((sum, i) => sum + i.amount, 0);
      const water = brine.filter((i) => /^water/.test(i.name)).reduce((sum, i) => sum + i.amount, 0);
      const l = PRODUCTS[id].testedLiquid;
      // Same proportions (the dilly beans' planner recipe is the half-size So Easy to Preserve one).
      expect(vinegar / (vinegar + water), id).toBeCloseTo(l.vinegarCups / (l.vinegarCups + l.waterCups), 10);
    }
  });

  it('names the weakest tested vinegar liquid: quick fresh-pack dill pickles', () => {
    expect(WEAKEST_TESTED.product.id).toBe('fresh-pack-dill-pickles');
    expect(VINEGAR_PICKLED_IDS).not.toContain('fermented-dill-pickles');
  });
});
