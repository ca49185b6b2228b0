import { describe, expect, it } from 'vitest';
import { isTimeZone, toZonedInput, zonedToUtc } from './time';

// Offsets from the IANA time zone database (tzdata, as shipped with Node's ICU): America/Denver is
// UTC−7 (MST) in winter and UTC−6 (MDT) from the second Sunday of March to the first Sunday of
// November (US Energy Policy Act of 2005 rules); America/Phoenix keeps UTC−7 all year.
describe('zonedToUtc', () => {
  it('turns 9:00 in Denver in December (MST, UTC−7) into 16:00 UTC', () => {
    expect(zonedToUtc('2026-12-15', '09:00', 'America/Denver').toISOString()).toBe('2026-12-15T16:00:00.000Z');
  });
  it('turns 9:00 in Denver in July (MDT, UTC−6) into 15:00 UTC', () => {
    expect(zonedToUtc('2026-07-15', '09:00', 'America/Denver').toISOString()).toBe('2026-07-15T15:00:00.000Z');
  });
  it('keeps Phoenix at UTC−7 in July (no daylight saving time)', () => {
    expect(zonedToUtc('2026-07-15', '09:00', 'America/Phoenix').toISOString()).toBe('2026-07-15T16:00:00.000Z');
  });
  it('crosses the date line backwards for an evening start', () => {
    expect(zonedToUtc('2026-12-15', '19:30', 'America/Los_Angeles').toISOString()).toBe('2026-12-16T03:30:00.000Z');
  });
  it('resolves a wall time skipped by the spring-forward change (2:30 on 8 March 2026 in Denver) to a real instant', () => {
    const instant = zonedToUtc('2026-03-08', '02:30', 'America/Denver');
    expect(toZonedInput(instant, 'America/Denver').date).toBe('2026-03-08');
    expect(['01:30', '03:30']).toContain(toZonedInput(instant, 'America/Denver').time);
  });
  it('round-trips with toZonedInput', () => {
    const instant = zonedToUtc('2027-01-09', '13:15', 'America/New_York');
    expect(toZonedInput(instant, 'America/New_York')).toEqual({ date: '2027-01-09', time: '13:15' });
  });
});

describe('isTimeZone', () => {
  it('accepts IANA names and refuses others', () => {
    expect(isTimeZone('America/Denver')).toBe(true);
    expect(isTimeZone('Mars/Olympus_Mons')).toBe(false);
  });
});
