/** What went wrong with a calculator input; `http.ts` maps each kind to one HTTP status. */
export type PreservingErrorKind = 'invalid' | 'not-found' | 'outside-table';

/**
 * The one error the preserving calculators throw.
 * - invalid: a missing, non-numeric, negative or impossible value (HTTP 400, `param` names it);
 * - not-found: an unknown product (HTTP 404);
 * - outside-table: valid input that the published table does not cover (HTTP 422). Its message
 *   tells the user to follow local guidance; the calculators never guess a number there.
 */
export class PreservingError extends Error {
  readonly kind: PreservingErrorKind;
  readonly param?: string;

  constructor(kind: PreservingErrorKind, message: string, param?: string) {
    super(message);
    this.name = 'PreservingError';
    this.kind = kind;
    this.param = param;
  }
}

/** The sentence every outside-table answer ends with. */
export const LOCAL_GUIDANCE =
  'Follow a tested recipe for your situation and the guidance of your local extension office; Brinewright does not guess a number outside the published table.';

export function outsideTable(reason: string, param?: string): PreservingError {
  return new PreservingError('outside-table', `${reason} ${LOCAL_GUIDANCE}`, param);
}

export type NumberRule = {
  /** Query parameter / field name, e.g. "altitudeFt". */
  param: string;
  /** Plain words for the value, e.g. "the altitude". */
  label: string;
  min?: number;
  /** When true, min itself is not allowed (e.g. a liquid volume must be above 0). */
  minExclusive?: boolean;
  max?: number;
  integer?: boolean;
};

const plain = (n: number) => (Number.isInteger(n) ? n.toLocaleString('en-US') : String(n));

/** Checks a number already parsed; the message names what is wrong in plain words. */
export function checkNumber(value: unknown, rule: NumberRule): number {
  const { param, label } = rule;
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new PreservingError('invalid', `Enter ${label} as a number.`, param);
  }
  const min = rule.min ?? 0;
  if (value < 0 && min >= 0) throw new PreservingError('invalid', `${capital(label)} cannot be negative.`, param);
  if (rule.minExclusive ? value <= min : value < min) {
    throw new PreservingError('invalid', `${capital(label)} must be ${rule.minExclusive ? 'more than' : 'at least'} ${plain(min)}.`, param);
  }
  if (rule.max !== undefined && value > rule.max) {
    throw new PreservingError('invalid', `${capital(label)} must be at most ${plain(rule.max)}.`, param);
  }
  if (rule.integer && !Number.isInteger(value)) {
    throw new PreservingError('invalid', `${capital(label)} must be a whole number.`, param);
  }
  return value;
}

const DECIMAL = /^[+-]?(\d+(\.\d*)?|\.\d+)(e[+-]?\d+)?$/i;
const FRACTION = /^(?:(\d+)\s+)?(\d+)\/(\d+)$/;

/**
 * Parses what a person typed (or a query string value): decimals, and simple fractions such as
 * "1/2" or "1 1/4" because headspace and recipes are written that way. Empty → "Enter … as a number."
 */
export function parseNumber(raw: string | null | undefined, rule: NumberRule): number {
  const text = (raw ?? '').trim().replace(/,/g, '');
  if (text === '') return checkNumber(undefined, rule);
  if (DECIMAL.test(text)) return checkNumber(Number(text), rule);
  const fraction = FRACTION.exec(text);
  if (fraction && Number(fraction[3]) !== 0) {
    return checkNumber(Number(fraction[1] ?? 0) + Number(fraction[2]) / Number(fraction[3]), rule);
  }
  return checkNumber(Number.NaN, rule);
}

/** Checks that a value is one of a fixed list (jar sizes, gauge types, salt kinds…). */
export function checkChoice<T extends string>(value: unknown, choices: readonly T[], param: string, label: string): T {
  if (typeof value === 'string' && (choices as readonly string[]).includes(value)) return value as T;
  throw new PreservingError('invalid', `Choose ${label}: ${choices.join(', ')}.`, param);
}

function capital(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/**
 * The rules for every numeric input, shared by the functions, the JSON routes (query parameters of
 * the same names) and the calculator components, so all three give the same message.
 */
export const RULES = {
  // Towns below sea level are allowed and use the lowest band; the lowest dry land, the Dead Sea
  // shore, is about 1,410 ft (430 m) below sea level (from memory).
  altitudeFt: { param: 'altitudeFt', label: 'the altitude in feet', min: -1500 },
  altitudeM: { param: 'altitudeM', label: 'the altitude in metres', min: -457 },
  jars: { param: 'jars', label: 'the number of jars', min: 1, max: 500, integer: true },
  measuredIn: { param: 'measuredIn', label: 'the measured headspace in inches', max: 6 },
  vinegarMl: { param: 'vinegarMl', label: 'the vinegar in mL' },
  vinegarAcidityPct: { param: 'vinegarAcidityPct', label: 'the vinegar acidity in %', max: 100 },
  waterMl: { param: 'waterMl', label: 'the water in mL' },
  otherMl: { param: 'otherMl', label: 'the other liquid in mL' },
  produceG: { param: 'produceG', label: 'the produce in grams' },
  produceWaterPct: { param: 'produceWaterPct', label: 'the water in the produce in %', max: 100 },
  amount: { param: 'amount', label: 'the amount of salt' },
  sugarAmount: { param: 'amount', label: 'the amount of sugar' },
  liquidMl: { param: 'liquidMl', label: 'the vinegar and water in mL' },
  brinePct: { param: 'brinePct', label: 'the brine strength in %', max: 26 },
  psig: { param: 'psig', label: 'the gauge pressure in psi', max: 20 },
  processedMinutes: { param: 'processedMinutes', label: 'the minutes processed' },
  /** Converter input: negative values are allowed here and refused by convert() unless a temperature. */
  value: { param: 'value', label: 'the value', min: Number.NEGATIVE_INFINITY },
} satisfies Record<string, NumberRule>;

/** Shared rule for altitude inputs (feet above sea level). */
export const ALTITUDE_RULE = RULES.altitudeFt;
/** Shared rule for jar counts. */
export const JARS_RULE = RULES.jars;
