import { describe, expect, it } from 'vitest';
import { cn } from './cn';

describe('cn', () => {
  it('lets a later class of the same property win', () => {
    expect(cn('px-4 py-2 font-semibold whitespace-nowrap', 'font-semibold whitespace-normal')).toBe('px-4 py-2 font-semibold whitespace-normal');
    expect(cn('px-4 py-2', 'px-2')).toBe('py-2 px-2');
  });

  it("keeps the theme's own classes that set different properties", () => {
    // text-sm is a size and text-ink-soft a colour; rounded-jar and shadow-shelf are theme tokens.
    expect(cn('text-sm text-ink-soft', 'rounded-jar shadow-shelf', 'font-display font-bold')).toBe(
      'text-sm text-ink-soft rounded-jar shadow-shelf font-display font-bold',
    );
  });

  it('drops false, null and undefined like clsx', () => {
    expect(cn('a', false, null, undefined, { b: true, c: false })).toBe('a b');
  });
});
