import { describe, expect, it } from 'vitest';
import { LOCAL_GUIDANCE, PreservingError, checkChoice, outsideTable, parseNumber } from './errors';

const rule = { param: 'waterMl', label: 'the water in mL' };

describe('parseNumber', () => {
  it('reads decimals, thousands separators and simple fractions', () => {
    expect(parseNumber('250', rule)).toBe(250);
    expect(parseNumber(' 0.5 ', rule)).toBe(0.5);
    expect(parseNumber('.75', rule)).toBe(0.75);
    expect(parseNumber('1,500', rule)).toBe(1500);
    expect(parseNumber('1/2', rule)).toBe(0.5);
    expect(parseNumber('1 1/4', rule)).toBe(1.25);
  });

  it('names the parameter and says what is wrong', () => {
    const fail = (raw: string | null, extra = {}) => {
      try {
        parseNumber(raw, { ...rule, ...extra });
      } catch (error) {
        return error as PreservingError;
      }
      throw new Error('expected a failure');
    };
    expect(fail(null)).toMatchObject({ kind: 'invalid', param: 'waterMl', message: 'Enter the water in mL as a number.' });
    expect(fail('')).toMatchObject({ message: 'Enter the water in mL as a number.' });
    expect(fail('lots')).toMatchObject({ message: 'Enter the water in mL as a number.' });
    expect(fail('1/0')).toMatchObject({ message: 'Enter the water in mL as a number.' });
    expect(fail('-3')).toMatchObject({ message: 'The water in mL cannot be negative.' });
    expect(fail('3.5', { integer: true })).toMatchObject({ message: 'The water in mL must be a whole number.' });
    expect(fail('0', { min: 1 })).toMatchObject({ message: 'The water in mL must be at least 1.' });
    expect(fail('20000', { max: 10000 })).toMatchObject({ message: 'The water in mL must be at most 10,000.' });
  });
});

describe('errors', () => {
  it('ends outside-table messages with the local-guidance sentence', () => {
    const error = outsideTable('Above the table.', 'altitudeFt');
    expect(error.kind).toBe('outside-table');
    expect(error.message).toBe(`Above the table. ${LOCAL_GUIDANCE}`);
  });

  it('lists the choices when a choice is wrong', () => {
    expect(checkChoice('pint', ['pint', 'quart'] as const, 'jar', 'a jar size')).toBe('pint');
    expect(() => checkChoice('crock', ['pint', 'quart'] as const, 'jar', 'a jar size')).toThrow('Choose a jar size: pint, quart.');
  });
});
