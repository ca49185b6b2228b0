// Brinewright's own practice card numbers (4600 for the pH 4.6 line). Both pass the Luhn check, so a
// form that checks it accepts them; only the fake payment server knows what they do.
export const CARDS = { pays: '4600460046004604', declined: '4600460090909096' } as const;

/** The number in groups of four, as a person types it. */
export const spaced = (digits: string) => digits.replace(/(\d{4})(?=\d)/g, '$1 ');

/** The Luhn check digit test (ISO/IEC 7812-1, annex B). */
export function luhnValid(digits: string): boolean {
  let sum = 0;
  [...digits].reverse().forEach((ch, i) => {
    let d = Number(ch);
    if (i % 2 === 1) {
      d *= 2;
      if (d > 9) d -= 9;
    }
    sum += d;
  });
  return digits.length > 0 && sum % 10 === 0;
}
