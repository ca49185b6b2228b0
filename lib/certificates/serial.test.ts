import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { SERIAL_ALPHABET, checkCharacter, generateSerial, gfMultiply, normalizeSerial } from './serial';

describe('certificate serials', () => {
  it('look like XXXX-XXXX-XXXX-XXXX in the unambiguous alphabet', () => {
    const serial = generateSerial();
    expect(serial).toMatch(/^[2-9A-HJ-NP-Z]{4}(-[2-9A-HJ-NP-Z]{4}){3}$/);
    expect(SERIAL_ALPHABET).not.toMatch(/[01IO]/);
    expect(SERIAL_ALPHABET).toHaveLength(32);
    expect(normalizeSerial(serial)).toBe(serial);
  });

  it('differ from one another (1000 draws, no repeat)', () => {
    const seen = new Set(Array.from({ length: 1000 }, () => generateSerial()));
    expect(seen.size).toBe(1000);
  });

  it('multiply in GF(32) with x^5 + x^2 + 1, where 2 (= x) has order 31', () => {
    // Worked by hand: x^4 · x = x^5 = x^2 + 1 → 0b00101 = 5; (x+1)(x+1) = x^2 + 1 = 5.
    expect(gfMultiply(16, 2)).toBe(5);
    expect(gfMultiply(3, 3)).toBe(5);
    let power = 1;
    const orders: number[] = [];
    for (let k = 1; k <= 31; k++) {
      power = gfMultiply(power, 2);
      if (power === 1) orders.push(k);
    }
    expect(orders).toEqual([31]);
  });

  it('compute the check character as Σ α^(i+1)·v_i', () => {
    // Worked by hand: '3' has value 1 and '4' value 2. '3' alone: α·1 = 2 → '4'.
    expect(checkCharacter('3')).toBe('4');
    // '34': α·1 + α²·2 = 2 XOR 8 = 10 → alphabet[10] = 'C'. All '2' (value 0) sums to 0 → '2'.
    expect(checkCharacter('34')).toBe('C');
    expect(checkCharacter('222222222222222')).toBe('2');
  });

  it('read typed serials regardless of case, spaces and hyphens', () => {
    const serial = generateSerial();
    expect(normalizeSerial(serial.toLowerCase().replace(/-/g, ' '))).toBe(serial);
    expect(normalizeSerial(serial.replace(/-/g, ''))).toBe(serial);
  });

  it('refuse wrong length and characters outside the alphabet', () => {
    expect(normalizeSerial('')).toBeNull();
    expect(normalizeSerial('ABCD-EFGH')).toBeNull();
    expect(normalizeSerial('0BCD-EFGH-JKLM-NPQR')).toBeNull();
  });

  it('detect every single wrong character and every swap of neighbours', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 15 }), fc.integer({ min: 1, max: 31 }), (position, shift) => {
        const compact = generateSerial().replace(/-/g, '');
        const wrong = SERIAL_ALPHABET[(SERIAL_ALPHABET.indexOf(compact[position]) + shift) % 32];
        const typo = compact.slice(0, position) + wrong + compact.slice(position + 1);
        expect(normalizeSerial(typo)).toBeNull();
      }),
      { numRuns: 500 },
    );
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 14 }), (position) => {
        const compact = generateSerial().replace(/-/g, '');
        if (compact[position] === compact[position + 1]) return;
        const swapped = compact.slice(0, position) + compact[position + 1] + compact[position] + compact.slice(position + 2);
        expect(normalizeSerial(swapped)).toBeNull();
      }),
      { numRuns: 500 },
    );
  });
});
