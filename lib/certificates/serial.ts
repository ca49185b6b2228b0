import { randomInt } from 'node:crypto';

/**
 * Certificate serials: 15 random characters and one check character, shown in four groups of four,
 * e.g. `K7QM-4TZP-XR9D-2HWC`.
 *
 * - The alphabet has 32 symbols and leaves out 0, 1, I and O, which are easily misread.
 * - The random part comes from `crypto.randomInt`, so it cannot be guessed: 15 × 5 = 75 bits.
 * - The check character is a weighted sum over the finite field GF(32) = GF(2)[x]/(x^5 + x^2 + 1):
 *   each character's value v_i (its index in the alphabet, a 5-bit field element) is multiplied by
 *   α^(i+1), where α = x is a primitive element (order 31), and the products are added (XOR).
 *   Why this catches typos (proof sketch, field arithmetic): one wrong character changes the sum by
 *   α^(i+1)·(a−b) ≠ 0; two neighbours swapped change it by α^(i+1)·(1+α)·(a−b) ≠ 0 since α ≠ 1;
 *   the last random character swapped with the check character changes it by (α^15 + 1)·(a−b) ≠ 0
 *   since α^15 ≠ 1. So every single wrong character and every swap of neighbouring characters is
 *   refused before the database is asked. (A sum modulo 32 cannot do both, because 32 is not prime.)
 */
export const SERIAL_ALPHABET = '23456789ABCDEFGHJKLMNPQRSTUVWXYZ';
const M = SERIAL_ALPHABET.length; // 32
export const SERIAL_RANDOM_LENGTH = 15;
export const SERIAL_LENGTH = SERIAL_RANDOM_LENGTH + 1;

function valueOf(char: string): number {
  const value = SERIAL_ALPHABET.indexOf(char);
  if (value < 0) throw new RangeError(`"${char}" is not a serial character`);
  return value;
}

/** Product of two elements of GF(32) with the reduction polynomial x^5 + x^2 + 1 (0b100101). */
export function gfMultiply(a: number, b: number): number {
  let product = 0;
  for (let i = 0; i < 5; i++) {
    if (b & 1) product ^= a;
    b >>= 1;
    a <<= 1;
    if (a & 0b100000) a ^= 0b100101;
  }
  return product;
}

/** The check character for a string of serial characters: Σ α^(i+1)·v_i over GF(32), α = 2. */
export function checkCharacter(body: string): string {
  let sum = 0;
  let weight = 1;
  for (const char of body) {
    weight = gfMultiply(weight, 2);
    sum ^= gfMultiply(weight, valueOf(char));
  }
  return SERIAL_ALPHABET[sum];
}

/** Groups 16 characters as XXXX-XXXX-XXXX-XXXX. */
export function formatSerial(compact: string): string {
  return compact.match(/.{1,4}/g)!.join('-');
}

/** A new random serial with its check character, formatted. */
export function generateSerial(random: (max: number) => number = randomInt): string {
  let body = '';
  for (let i = 0; i < SERIAL_RANDOM_LENGTH; i++) body += SERIAL_ALPHABET[random(M)];
  return formatSerial(body + checkCharacter(body));
}

/**
 * Reads what someone typed: case, spaces and hyphens do not matter. Returns the formatted serial,
 * or null when it has the wrong length, a character outside the alphabet or a wrong check character.
 */
export function normalizeSerial(input: string): string | null {
  const compact = input.toUpperCase().replace(/[\s-]/g, '');
  if (compact.length !== SERIAL_LENGTH) return null;
  if ([...compact].some((c) => !SERIAL_ALPHABET.includes(c))) return null;
  const body = compact.slice(0, SERIAL_RANDOM_LENGTH);
  if (checkCharacter(body) !== compact[SERIAL_RANDOM_LENGTH]) return null;
  return formatSerial(compact);
}

export const isValidSerial = (input: string): boolean => normalizeSerial(input) !== null;
