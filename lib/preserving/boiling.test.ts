import { describe, expect, it } from 'vitest';
import { PA_PER_PSI, boilingPoint, cannerTemperature, saturationPressurePa, saturationTemperatureK, standardPressurePa } from './boiling';

describe('IAPWS-IF97 region 4', () => {
  // IAPWS, Revised Release on the IAPWS Industrial Formulation 1997 (2007), Table 35 (T_s(p)) and
  // Table 36 (p_s(T)) computer-program verification values.
  it('reproduces the T_s(p) check values of Table 35', () => {
    expect(saturationTemperatureK(0.1e6)).toBeCloseTo(372.755919, 5);
    expect(saturationTemperatureK(1e6)).toBeCloseTo(453.035632, 5);
    expect(saturationTemperatureK(10e6)).toBeCloseTo(584.149488, 5);
  });

  it('reproduces the p_s(T) check values of Table 36', () => {
    expect(saturationPressurePa(300) / 1e6).toBeCloseTo(0.00353658941, 10);
    expect(saturationPressurePa(500) / 1e6).toBeCloseTo(2.63889776, 7);
    expect(saturationPressurePa(600) / 1e6).toBeCloseTo(12.3443146, 6);
  });

  it('is its own inverse', () => {
    for (const t of [330, 360, 373.124, 390]) expect(saturationTemperatureK(saturationPressurePa(t))).toBeCloseTo(t, 6);
  });
});

describe('U.S. Standard Atmosphere, 1976', () => {
  it('matches the pressures of its Table I at geometric altitudes (values from memory; ±0.01 %)', () => {
    const table: [number, number][] = [
      [0, 101325],
      [1000, 89876],
      [2000, 79501],
      [3000, 70121],
      [5000, 54048],
      [10000, 26500],
    ];
    for (const [m, pa] of table) expect(Math.abs(standardPressurePa(m) - pa) / pa).toBeLessThan(1e-4);
  });
});

describe('boilingPoint', () => {
  it('gives 99.97 °C at sea level (boiling point of water on ITS-90 at 101.325 kPa)', () => {
    const r = boilingPoint({ altitudeFt: 0 });
    expect(r.celsius).toBeCloseTo(99.974, 2);
    expect(r.pressurePa).toBe(101325);
  });

  it('matches the published boiling points by altitude (±0.2 °F against the rounded table)', () => {
    // Table of the boiling point of water by altitude credited to NOAA/NASA standard-atmosphere
    // figures (secondary source): 0 ft 212 °F, 1,000 ft 210.2, 5,000 ft 203, 8,000 ft 197.4,
    // 10,000 ft 193.6. The 212 °F row is the old (pre-ITS-90) scale, hence the wider 0.1 °F gap there.
    const published: [number, number][] = [
      [0, 212],
      [1000, 210.2],
      [5000, 203],
      [8000, 197.4],
      [10000, 193.6],
    ];
    for (const [ft, f] of published) expect(Math.abs(boilingPoint({ altitudeFt: ft }).fahrenheit - f), `${ft} ft`).toBeLessThanOrEqual(0.2);
  });

  it('gives the computed table of REFERENCES.md §8 (1976 atmosphere + IF97; computed values)', () => {
    const computed: [number, number, number][] = [
      [1000, 97717, 210.13],
      [3000, 90813, 206.48],
      [5000, 84311, 202.83],
      [8000, 75271, 197.34],
      [10000, 69695, 193.67],
    ];
    for (const [ft, pa, f] of computed) {
      const r = boilingPoint({ altitudeFt: ft });
      expect(Math.round(r.pressurePa)).toBe(pa);
      expect(r.fahrenheit).toBeCloseTo(f, 2);
      expect(r.celsius).toBeCloseTo(((f - 32) * 5) / 9, 2);
    }
  });

  it('answers below sea level (1976 standard atmosphere: pressure above 101,325 Pa, water boils above 212 °F)', () => {
    const below = boilingPoint({ altitudeFt: -282 });
    expect(below.pressurePa).toBeGreaterThan(101325);
    expect(below.fahrenheit).toBeGreaterThan(boilingPoint({ altitudeFt: 0 }).fahrenheit);
  });

  it('refuses altitudes below the lowest dry land and above the model layer', () => {
    expect(() => boilingPoint({ altitudeFt: -1501 })).toThrow('The altitude in feet must be at least -1,500.');
    expect(() => boilingPoint({ altitudeFt: 40000 })).toThrow(/local extension office/);
  });
});

describe('cannerTemperature', () => {
  it('uses the exact psi (NIST SP 811: 1 psi = 6894.757 Pa)', () => {
    expect(PA_PER_PSI).toBeCloseTo(6894.757293, 5);
  });

  it('shows why the USDA gauge table rises with altitude: every row lands near 240 °F', () => {
    // USDA Complete Guide to Home Canning (rev. 2015), Guide 1: pressure canners reach 240 °F at
    // 10 psi at sea level. Computed cross-check of the dial-gauge table (REFERENCES.md §2, computed).
    const rows: [number, number, number][] = [
      [10, 0, 239.4],
      [10.5, 0, 240.5],
      [11, 2000, 239.3],
      [12, 4000, 239.4],
      [13, 6000, 239.5],
      [14, 8000, 239.9],
      [15, 10000, 240.3],
    ];
    for (const [psig, ft, f] of rows)
      expect(Math.abs(cannerTemperature({ psig, altitudeFt: ft }).fahrenheit - f), `${psig} psig at ${ft} ft`).toBeLessThan(0.06);
  });
});
