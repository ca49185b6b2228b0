import { PreservingError, RULES, checkNumber } from './errors';

/**
 * Exact unit definitions (NIST Handbook 44, 2024 edition, Appendix C, "General tables of units of
 * measurement"): 1 US gallon = 231 in³, 1 in = 2.54 cm, 1 lb (avoirdupois) = 0.453 592 37 kg,
 * 1 ft = 0.3048 m. US customary kitchen measures: 1 gal = 4 qt = 8 pt = 16 cups = 128 fl oz;
 * 1 fl oz = 2 tbsp = 6 tsp. From those, every factor below is exact (within binary floating point).
 */
export const UNITS = ['cup', 'tbsp', 'tsp', 'fl-oz', 'pint', 'quart', 'gallon', 'mL', 'L', 'g', 'kg', 'oz', 'lb', 'F', 'C', 'ft', 'm'] as const;
export type Unit = (typeof UNITS)[number];
export type UnitKind = 'volume' | 'mass' | 'temperature' | 'length';

const GALLON_ML = 231 * 2.54 ** 3; // 3785.411784 mL

/** Size of each unit in its kind's base unit (mL, g, m); temperature is handled apart. */
const FACTORS: Record<Exclude<Unit, 'F' | 'C'>, { kind: Exclude<UnitKind, 'temperature'>; base: number }> = {
  gallon: { kind: 'volume', base: GALLON_ML },
  quart: { kind: 'volume', base: GALLON_ML / 4 },
  pint: { kind: 'volume', base: GALLON_ML / 8 },
  cup: { kind: 'volume', base: GALLON_ML / 16 },
  'fl-oz': { kind: 'volume', base: GALLON_ML / 128 },
  tbsp: { kind: 'volume', base: GALLON_ML / 256 },
  tsp: { kind: 'volume', base: GALLON_ML / 768 },
  mL: { kind: 'volume', base: 1 },
  L: { kind: 'volume', base: 1000 },
  g: { kind: 'mass', base: 1 },
  kg: { kind: 'mass', base: 1000 },
  lb: { kind: 'mass', base: 453.59237 },
  oz: { kind: 'mass', base: 453.59237 / 16 },
  m: { kind: 'length', base: 1 },
  ft: { kind: 'length', base: 0.3048 },
};

export const UNIT_LABELS: Record<Unit, string> = {
  cup: 'cups (US)',
  tbsp: 'tablespoons (US)',
  tsp: 'teaspoons (US)',
  'fl-oz': 'fluid ounces (US)',
  pint: 'pints (US)',
  quart: 'quarts (US)',
  gallon: 'gallons (US)',
  mL: 'millilitres',
  L: 'litres',
  g: 'grams',
  kg: 'kilograms',
  oz: 'ounces (avoirdupois)',
  lb: 'pounds',
  F: 'degrees Fahrenheit',
  C: 'degrees Celsius',
  ft: 'feet',
  m: 'metres',
};

export const isUnit = (value: unknown): value is Unit => typeof value === 'string' && (UNITS as readonly string[]).includes(value);

export function unitKind(unit: Unit): UnitKind {
  return unit === 'F' || unit === 'C' ? 'temperature' : FACTORS[unit].kind;
}

function checkUnit(value: unknown, param: 'from' | 'to'): Unit {
  if (isUnit(value)) return value;
  throw new PreservingError('invalid', `Choose a unit to convert ${param}: ${UNITS.join(', ')}.`, param);
}

/** Absolute zero, the lowest temperature there is. */
const ABSOLUTE_ZERO: Record<'F' | 'C', number> = { C: -273.15, F: -459.67 };

/**
 * Converts between units of the same kind. Different kinds (a volume to a length, or a volume to a
 * weight, which needs a density) are refused as invalid.
 */
export function convert(value: number, from: Unit | string, to: Unit | string): number {
  const source = checkUnit(from, 'from');
  const target = checkUnit(to, 'to');
  const kind = unitKind(source);
  const targetKind = unitKind(target);
  if (kind !== targetKind) {
    const density = (kind === 'volume' && targetKind === 'mass') || (kind === 'mass' && targetKind === 'volume');
    throw new PreservingError(
      'invalid',
      density
        ? `A ${kind} (${source}) cannot be converted to a ${targetKind} (${target}) without a stated density; use the salt calculator for salt.`
        : `A ${kind} (${source}) cannot be converted to a ${targetKind} (${target}).`,
      'to',
    );
  }
  if (kind === 'temperature') {
    const t = checkNumber(value, { param: 'value', label: 'the value', min: ABSOLUTE_ZERO[source as 'F' | 'C'] });
    if (source === target) return t;
    return source === 'F' ? ((t - 32) * 5) / 9 : (t * 9) / 5 + 32;
  }
  const amount = checkNumber(value, { param: 'value', label: 'the value' });
  if (source === target) return amount;
  return (amount * FACTORS[source as keyof typeof FACTORS].base) / FACTORS[target as keyof typeof FACTORS].base;
}

/** Millilitres in one unit of a volume (exact). */
export const mlPer = (unit: Exclude<Unit, 'g' | 'kg' | 'oz' | 'lb' | 'F' | 'C' | 'ft' | 'm'>) => FACTORS[unit].base;

export const ALTITUDE_UNITS = ['ft', 'm'] as const;
export type AltitudeUnit = (typeof ALTITUDE_UNITS)[number];

/** An altitude typed in feet or metres, in feet (1 ft = 0.3048 m exactly, NIST Handbook 44). Each unit
 * has its own rule, so a wrong value is named in the unit it was typed in. */
export function altitudeInFeet(value: number, unit: AltitudeUnit | string): number {
  if (unit === 'm') return checkNumber(value, RULES.altitudeM) / 0.3048;
  if (unit === 'ft') return checkNumber(value, RULES.altitudeFt);
  throw new PreservingError('invalid', `Choose the altitude's unit: ${ALTITUDE_UNITS.join(', ')}.`, 'altitudeUnit');
}

/** Jar capacities: a pint jar holds one US pint, a quart jar one US quart (common practice). */
export const JAR_ML = { 'half-pint': GALLON_ML / 16, pint: GALLON_ML / 8, quart: GALLON_ML / 4 } as const;
/** Pint-jar equivalents of each jar size. */
export const JAR_PINTS = { 'half-pint': 0.5, pint: 1, quart: 2 } as const;

/**
 * Grams of a dry ingredient given by volume (at a stated grams per US cup) or by weight. `what`
 * names the ingredient in the message when the unit is neither, e.g. 'the sugar'.
 */
export function gramsOf(value: number, unit: Unit | string, gramsPerCup: number, what: string): number {
  if (!isUnit(unit) || (unitKind(unit) !== 'volume' && unitKind(unit) !== 'mass')) {
    throw new PreservingError('invalid', `Choose a unit for ${what}: a volume (tsp, tbsp, cup, mL…) or a weight (g, kg, oz, lb).`, 'unit');
  }
  return unitKind(unit) === 'mass' ? convert(value, unit, 'g') : convert(value, unit, 'cup') * gramsPerCup;
}
