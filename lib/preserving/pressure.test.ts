import { describe, expect, it } from 'vitest';
import { pressureForAltitude } from './pressure';

describe('pressureForAltitude', () => {
  // USDA Complete Guide to Home Canning (AIB 539, rev. 2015), Guide 4, "Snap and Italian beans"
  // (and every vegetable): weighted gauge 10 lb at 0–1,000 ft, 15 lb above 1,000 ft; dial gauge
  // 11 lb at 0–2,000 ft, 12 at 2,001–4,000, 13 at 4,001–6,000, 14 at 6,001–8,000.
  it('gives the whole weighted-gauge table', () => {
    const at = (altitudeFt: number) => pressureForAltitude({ gauge: 'weighted', altitudeFt }).pounds;
    expect([0, 500, 1000].map(at)).toEqual([10, 10, 10]);
    expect([1000.5, 1001, 2000, 4000, 6000, 8000, 10000].map(at)).toEqual([15, 15, 15, 15, 15, 15, 15]);
  });

  it('gives the whole dial-gauge table', () => {
    const at = (altitudeFt: number) => pressureForAltitude({ gauge: 'dial', altitudeFt }).pounds;
    expect([0, 1000, 2000].map(at)).toEqual([11, 11, 11]);
    expect([2001, 3000, 4000].map(at)).toEqual([12, 12, 12]);
    expect([4001, 5000, 6000].map(at)).toEqual([13, 13, 13]);
    expect([6001, 7000, 8000].map(at)).toEqual([14, 14, 14]);
  });

  it('labels the 8,001–10,000 ft dial row (15 lb; a jar maker’s altitude chart, secondary) as outside the USDA tables', () => {
    const r = pressureForAltitude({ gauge: 'dial', altitudeFt: 9000 });
    expect(r.pounds).toBe(15);
    expect(r.confidence).toBe('secondary');
    expect(r.source).toContain('not in the USDA tables');
    expect(r.altitudeBand).toEqual({ fromFt: 8001, toFt: 10000 });
    expect(pressureForAltitude({ gauge: 'dial', altitudeFt: 100 }).confidence).toBe('verified');
  });

  it('answers outside-table above 10,000 ft and invalid for a bad gauge or altitude', () => {
    expect(() => pressureForAltitude({ gauge: 'dial', altitudeFt: 10500 })).toThrow(/local extension office/);
    expect(() => pressureForAltitude({ gauge: 'spring', altitudeFt: 0 })).toThrow('Choose a gauge type: weighted, dial.');
    expect(() => pressureForAltitude({ gauge: 'dial', altitudeFt: -1501 })).toThrow('The altitude in feet must be at least -1,500.');
  });

  it('uses the lowest band below sea level (USDA Guide 4: dial 11 psi, weighted 10 psi at 0–1,000 ft)', () => {
    expect(pressureForAltitude({ gauge: 'dial', altitudeFt: -200 })).toMatchObject({ pounds: 11, altitudeBand: { fromFt: 0, toFt: 2000 } });
    expect(pressureForAltitude({ gauge: 'weighted', altitudeFt: -1400 }).pounds).toBe(10);
  });
});
