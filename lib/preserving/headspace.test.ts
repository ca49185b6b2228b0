import { describe, expect, it } from 'vitest';
import { headspaceCheck } from './headspace';
import { PRODUCT_IDS } from './products';

describe('headspaceCheck', () => {
  it('recommends 1/2 inch for every pickled product (USDA Complete Guide, rev. 2015, Guide 6 procedures: "leaving 1/2-inch headspace")', () => {
    for (const product of PRODUCT_IDS) {
      expect(headspaceCheck({ product })).toEqual({ recommendedIn: 0.5, source: expect.stringContaining('Guide') });
    }
  });

  it('gives a verdict within 1/8 inch (the tolerance is common practice, not a published figure)', () => {
    const at = (measuredIn: number) => headspaceCheck({ product: 'fresh-pack-dill-pickles', measuredIn }).verdict;
    expect(at(0.25)).toBe('too-little');
    expect(at(0.37)).toBe('too-little');
    expect(at(0.375)).toBe('ok');
    expect(at(0.5)).toBe('ok');
    expect(at(0.625)).toBe('ok');
    expect(at(0.7)).toBe('too-much');
    expect(at(1)).toBe('too-much');
  });

  it('says why the verdict matters', () => {
    expect(headspaceCheck({ product: 'pickle-relish', measuredIn: 0 }).why).toMatch(/seal/);
    expect(headspaceCheck({ product: 'pickle-relish', measuredIn: 2 }).why).toMatch(/air/);
  });

  it('refuses a negative measurement and an unknown product', () => {
    expect(() => headspaceCheck({ product: 'pickle-relish', measuredIn: -0.5 })).toThrow('The measured headspace in inches cannot be negative.');
    expect(() => headspaceCheck({ product: 'sauerkraut' })).toThrow(/no product/);
  });
});
