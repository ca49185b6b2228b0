import { createRequire } from 'node:module';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { PreservingError } from './errors';
import { UNITS, altitudeInFeet, convert, unitKind, type Unit } from './units';

// convert-units ships no type declarations; load it with a small local type.
type ConvertUnits = (value: number) => { from: (unit: string) => { to: (unit: string) => number } };
const convertUnits = createRequire(import.meta.url)('convert-units') as ConvertUnits;

describe('convert: exact definitions, NIST Handbook 44, Appendix C', () => {
  it('gives the exact millilitres of each US kitchen measure (1 gal = 231 in³, 1 in = 2.54 cm)', () => {
    const exact: [Unit, number][] = [
      ['gallon', 3785.411784],
      ['quart', 946.352946],
      ['pint', 473.176473],
      ['cup', 236.5882365],
      ['fl-oz', 29.5735295625],
      ['tbsp', 14.78676478125],
      ['tsp', 4.92892159375],
    ];
    for (const [unit, ml] of exact) expect(convert(1, unit, 'mL')).toBeCloseTo(ml, 9);
  });

  it('gives the exact mass and length definitions', () => {
    expect(convert(1, 'lb', 'g')).toBe(453.59237);
    expect(convert(1, 'oz', 'g')).toBeCloseTo(28.349523125, 12);
    expect(convert(1, 'ft', 'm')).toBeCloseTo(0.3048, 15);
    expect(convert(10000, 'ft', 'm')).toBeCloseTo(3048, 9);
    expect(convert(2, 'kg', 'lb')).toBeCloseTo(4.40924524, 8);
  });

  it('converts temperatures (212 °F = 100 °C; 0 °C = 32 °F; −40 is the same on both)', () => {
    expect(convert(212, 'F', 'C')).toBeCloseTo(100, 12);
    expect(convert(0, 'C', 'F')).toBe(32);
    expect(convert(-40, 'C', 'F')).toBeCloseTo(-40, 12);
    expect(convert(240, 'F', 'C')).toBeCloseTo(115.5556, 4);
  });

  it('keeps kitchen relations exact: 3 tsp = 1 tbsp, 16 tbsp = 1 cup, 4 cups = 1 quart', () => {
    expect(convert(3, 'tsp', 'tbsp')).toBeCloseTo(1, 14);
    expect(convert(16, 'tbsp', 'cup')).toBeCloseTo(1, 14);
    expect(convert(4, 'cup', 'quart')).toBeCloseTo(1, 14);
    expect(convert(1, 'gallon', 'fl-oz')).toBeCloseTo(128, 12);
  });
});

describe('convert: cross-checked against the convert-units package (npm, 2.3.4)', () => {
  // convert-units rounds some definitions (lb = 453.592 g, oz = 28.3495 g; its US volumes and the
  // foot carry about 3e-9 relative error), so the tolerance is relative 2e-6.
  const names: Partial<Record<Unit, string>> = {
    cup: 'cup',
    tbsp: 'Tbs',
    tsp: 'tsp',
    'fl-oz': 'fl-oz',
    pint: 'pnt',
    quart: 'qt',
    gallon: 'gal',
    mL: 'ml',
    L: 'l',
    g: 'g',
    kg: 'kg',
    oz: 'oz',
    lb: 'lb',
    F: 'F',
    C: 'C',
    ft: 'ft',
    m: 'm',
  };
  it('agrees for every pair of units of the same kind over random values', () => {
    const pairs = UNITS.flatMap((a) => UNITS.filter((b) => unitKind(a) === unitKind(b)).map((b) => [a, b] as const));
    fc.assert(
      fc.property(fc.constantFrom(...pairs), fc.double({ min: 0.001, max: 10000, noNaN: true }), ([from, to], value) => {
        const ours = convert(value, from, to);
        const theirs = convertUnits(value).from(names[from]!).to(names[to]!);
        expect(Math.abs(ours - theirs)).toBeLessThanOrEqual(Math.abs(theirs) * 2e-6 + 1e-9);
      }),
      { numRuns: 500 },
    );
  });
});

describe('convert: refusals', () => {
  const refusal = (fn: () => unknown) => {
    try {
      fn();
    } catch (error) {
      return error as PreservingError;
    }
    throw new Error('expected a refusal');
  };

  it('refuses a volume to a weight (no density) and a volume to a length, as invalid', () => {
    expect(refusal(() => convert(1, 'cup', 'g'))).toMatchObject({ kind: 'invalid', param: 'to', message: expect.stringContaining('density') });
    expect(refusal(() => convert(1, 'L', 'ft'))).toMatchObject({ kind: 'invalid', param: 'to' });
    expect(refusal(() => convert(1, 'F', 'm'))).toMatchObject({ kind: 'invalid' });
  });

  it('refuses unknown units, negative amounts and temperatures below absolute zero', () => {
    expect(refusal(() => convert(1, 'bushel', 'L'))).toMatchObject({ kind: 'invalid', param: 'from' });
    expect(refusal(() => convert(1, 'L', 'peck'))).toMatchObject({ kind: 'invalid', param: 'to' });
    expect(refusal(() => convert(-1, 'cup', 'mL'))).toMatchObject({ kind: 'invalid', param: 'value' });
    expect(convert(-18, 'C', 'F')).toBeCloseTo(-0.4, 10);
    expect(refusal(() => convert(-500, 'F', 'C'))).toMatchObject({ kind: 'invalid', param: 'value' });
  });
});

describe('altitudeInFeet', () => {
  it('reads metres exactly (1 ft = 0.3048 m, NIST Handbook 44) and feet as typed', () => {
    expect(altitudeInFeet(304.8, 'm')).toBeCloseTo(1000, 10);
    expect(altitudeInFeet(1829, 'ft')).toBe(1829);
    expect(altitudeInFeet(-86, 'm')).toBeCloseTo(-282.152, 3);
  });

  it('refuses altitudes below the lowest dry land (about -430 m, from memory), in the unit typed', () => {
    expect(() => altitudeInFeet(-458, 'm')).toThrow('The altitude in metres must be at least -457.');
    expect(() => altitudeInFeet(-1501, 'ft')).toThrow('The altitude in feet must be at least -1,500.');
    expect(() => altitudeInFeet(1, 'yd')).toThrow(/Choose the altitude's unit: ft, m/);
  });
});
