import { inflateSync } from 'node:zlib';

/**
 * Turns a WOFF 1.0 font back into the TrueType/OpenType (sfnt) file it wraps, following the W3C
 * Recommendation "WOFF File Format 1.0" (13 December 2012): a 44-byte header, a 20-byte directory
 * entry per table, each table zlib-compressed when that made it smaller. PDF files embed sfnt
 * fonts, not WOFF, and @fontsource/merriweather ships only .woff and .woff2; .woff needs nothing
 * beyond node:zlib, so it is converted here, offline, once per process.
 */
export function woffToSfnt(woff: Uint8Array): Buffer {
  const input = Buffer.from(woff.buffer, woff.byteOffset, woff.byteLength);
  if (input.toString('latin1', 0, 4) !== 'wOFF') throw new Error('not a WOFF 1.0 file');
  const flavor = input.readUInt32BE(4);
  const numTables = input.readUInt16BE(12);
  const tables: { tag: number; checksum: number; data: Buffer }[] = [];
  for (let i = 0; i < numTables; i++) {
    const at = 44 + i * 20;
    const tag = input.readUInt32BE(at);
    const offset = input.readUInt32BE(at + 4);
    const compLength = input.readUInt32BE(at + 8);
    const origLength = input.readUInt32BE(at + 12);
    const checksum = input.readUInt32BE(at + 16);
    const raw = input.subarray(offset, offset + compLength);
    const data = compLength < origLength ? inflateSync(raw) : Buffer.from(raw);
    if (data.length !== origLength) throw new Error('WOFF table has the wrong length after inflating');
    tables.push({ tag, checksum, data });
  }
  // sfnt offset table: searchRange etc. from the largest power of two ≤ numTables.
  let entrySelector = 0;
  while (2 ** (entrySelector + 1) <= numTables) entrySelector++;
  const searchRange = 2 ** entrySelector * 16;
  const headerLength = 12 + numTables * 16;
  const padded = (n: number) => (n + 3) & ~3;
  const total = headerLength + tables.reduce((sum, t) => sum + padded(t.data.length), 0);
  const out = Buffer.alloc(total);
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(numTables, 4);
  out.writeUInt16BE(searchRange, 6);
  out.writeUInt16BE(entrySelector, 8);
  out.writeUInt16BE(numTables * 16 - searchRange, 10);
  let offset = headerLength;
  tables.forEach((t, i) => {
    const at = 12 + i * 16;
    out.writeUInt32BE(t.tag, at);
    out.writeUInt32BE(t.checksum, at + 4);
    out.writeUInt32BE(offset, at + 8);
    out.writeUInt32BE(t.data.length, at + 12);
    t.data.copy(out, offset);
    offset += padded(t.data.length);
  });
  return out;
}
