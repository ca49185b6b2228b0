import fs from 'node:fs';
import path from 'node:path';
import * as fontkitModule from '@pdf-lib/fontkit';
import { describe, expect, it } from 'vitest';
import { woffToSfnt } from './woff';

const fontkit = ((fontkitModule as unknown as { default?: typeof fontkitModule }).default ?? fontkitModule) as typeof fontkitModule;
const file = (name: string) => fs.readFileSync(path.join(process.cwd(), 'node_modules/@fontsource/merriweather/files', name));

describe('woffToSfnt (W3C WOFF File Format 1.0)', () => {
  it('unwraps Merriweather into a TrueType file with every table, readable by fontkit', () => {
    const woff = file('merriweather-latin-700-normal.woff');
    const sfnt = woffToSfnt(woff);
    // Header fields: flavor (0x00010000 for TrueType outlines) and numTables are copied over.
    expect(sfnt.readUInt32BE(0)).toBe(woff.readUInt32BE(4));
    expect(sfnt.readUInt16BE(4)).toBe(woff.readUInt16BE(12));
    // The WOFF header's totalSfntSize is the size of the font it wraps.
    expect(sfnt.length).toBe(woff.readUInt32BE(16));
    const font = fontkit.create(sfnt);
    expect(font.familyName).toMatch(/Merriweather/);
    expect(font.hasGlyphForCodePoint('é'.codePointAt(0)!)).toBe(true);
    expect(font.hasGlyphForCodePoint('ł'.codePointAt(0)!)).toBe(false);
    expect(fontkit.create(woffToSfnt(file('merriweather-latin-ext-700-normal.woff'))).hasGlyphForCodePoint('ł'.codePointAt(0)!)).toBe(true);
  });

  it('refuses a file that is not WOFF 1.0', () => {
    expect(() => woffToSfnt(file('merriweather-latin-700-normal.woff2'))).toThrow(/not a WOFF 1.0 file/);
  });
});
