import { describe, expect, it } from 'vitest';
import { addMonths, certificateState, refresherDue, validUntilFor } from './validity';

const d = (iso: string) => new Date(iso);

describe('addMonths', () => {
  it('adds calendar months and clamps to the end of a shorter month', () => {
    expect(addMonths(d('2026-01-15T10:00:00Z'), 36).toISOString()).toBe('2029-01-15T10:00:00.000Z');
    expect(addMonths(d('2026-01-31T00:00:00Z'), 1).toISOString()).toBe('2026-02-28T00:00:00.000Z');
    expect(addMonths(d('2027-01-31T00:00:00Z'), 13).toISOString()).toBe('2028-02-29T00:00:00.000Z'); // 2028 is a leap year
    expect(addMonths(d('2026-03-31T00:00:00Z'), -1).toISOString()).toBe('2026-02-28T00:00:00.000Z');
  });
});

describe('certificateState', () => {
  it('is valid until valid-until, expired after, revoked whatever the dates', () => {
    const cert = { validUntil: d('2027-01-01T00:00:00Z'), revokedAt: null };
    expect(certificateState(cert, d('2027-01-01T00:00:00Z'))).toBe('valid');
    expect(certificateState(cert, d('2027-01-01T00:00:01Z'))).toBe('expired');
    expect(certificateState({ ...cert, revokedAt: d('2026-06-01T00:00:00Z') }, d('2026-01-01T00:00:00Z'))).toBe('revoked');
  });
});

describe('validUntilFor (the refresher rule)', () => {
  const issuedAt = d('2029-01-01T00:00:00Z');
  it('counts a flagship certificate from its issue date', () => {
    expect(validUntilFor({ courseSlug: 'pickling-and-canning', validityMonths: 36, issuedAt }).toISOString()).toBe('2032-01-01T00:00:00.000Z');
  });
  it('extends from the end of a still-valid earlier certificate, so no time is lost', () => {
    const prior = [{ courseSlug: 'pickling-and-canning', validUntil: d('2029-06-01T00:00:00Z'), revokedAt: null }];
    expect(validUntilFor({ courseSlug: 'volunteer-refresher', validityMonths: 36, issuedAt, prior }).toISOString()).toBe('2032-06-01T00:00:00.000Z');
  });
  it('counts from the issue date when the earlier one lapsed recently, and ignores long-lapsed or revoked ones', () => {
    const recent = [{ courseSlug: 'pickling-and-canning', validUntil: d('2028-06-01T00:00:00Z'), revokedAt: null }];
    expect(validUntilFor({ courseSlug: 'volunteer-refresher', validityMonths: 24, issuedAt, prior: recent }).toISOString()).toBe('2031-01-01T00:00:00.000Z');
    const revoked = [{ courseSlug: 'pickling-and-canning', validUntil: d('2030-06-01T00:00:00Z'), revokedAt: d('2028-01-01T00:00:00Z') }];
    expect(validUntilFor({ courseSlug: 'volunteer-refresher', validityMonths: 24, issuedAt, prior: revoked }).toISOString()).toBe('2031-01-01T00:00:00.000Z');
  });
  it('does not let the refresher stretch other courses', () => {
    const prior = [{ courseSlug: 'pickling-and-canning', validUntil: d('2030-06-01T00:00:00Z'), revokedAt: null }];
    expect(validUntilFor({ courseSlug: 'pickling-and-canning', validityMonths: 36, issuedAt, prior }).toISOString()).toBe('2032-01-01T00:00:00.000Z');
  });
});

describe('refresherDue', () => {
  const cert = { courseSlug: 'pickling-and-canning', validUntil: d('2029-12-01T00:00:00Z'), revokedAt: null };
  it('offers the refresher from three months before expiry, and after it', () => {
    expect(refresherDue(cert, d('2029-08-31T00:00:00Z'))).toBe(false);
    expect(refresherDue(cert, d('2029-09-01T00:00:00Z'))).toBe(true);
    expect(refresherDue(cert, d('2030-03-01T00:00:00Z'))).toBe(true);
    expect(refresherDue({ ...cert, revokedAt: d('2029-01-01T00:00:00Z') }, d('2030-03-01T00:00:00Z'))).toBe(false);
  });
});
