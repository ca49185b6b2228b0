import { inflateSync } from 'node:zlib';
import jsQR from 'jsqr';
import { PDFArray, PDFDict, PDFDocument, PDFName, PDFRawStream } from 'pdf-lib';
import { PDFParse } from 'pdf-parse';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { renderCertificatePdf } from './pdf';
import { qrMatrix, qrPng, qrRuns, verificationUrl } from './qr';
import { generateSerial } from './serial';

const input = () => ({
  holderName: 'Renée Dubois-Ñúñez',
  courseTitle: 'Safe Pickling and Water-Bath Canning',
  programName: 'Cedar Hollow County home-preserving program',
  serial: generateSerial(),
  issuedAt: new Date('2026-12-01T10:00:00Z'),
  validUntil: new Date('2029-12-01T10:00:00Z'),
  appUrl: 'http://127.0.0.1:3170',
});

/** The page's content stream(s), inflated. */
async function pageContent(bytes: Uint8Array): Promise<string> {
  const doc = await PDFDocument.load(bytes);
  const contents = doc.getPage(0).node.Contents()!;
  const streams = contents instanceof PDFArray ? contents.asArray().map((ref) => doc.context.lookup(ref)) : [contents];
  return streams
    .map((stream) => {
      const raw = stream as PDFRawStream;
      return (raw.dict.get(PDFName.of('Filter')) ? inflateSync(raw.contents) : Buffer.from(raw.contents)).toString('latin1');
    })
    .join('\n');
}

/**
 * Renders the QR code the PDF draws: every `x y w h re` rectangle of the black path is painted
 * into a bitmap (4 px per point) over the white square, which jsQR then reads like a camera would.
 */
function rasteriseQr(content: string, box: { x: number; y: number; size: number }) {
  const path = content.slice(content.indexOf('0 0 0 rg'));
  const rects = [...path.slice(0, path.indexOf('\nf\n')).matchAll(/([\d.]+) ([\d.]+) ([\d.]+) ([\d.]+) re/g)].map((m) => m.slice(1, 5).map(Number));
  const scale = 4;
  const side = box.size * scale;
  const rgba = new Uint8ClampedArray(side * side * 4).fill(255);
  for (const [x, y, w, h] of rects) {
    const left = Math.round((x - box.x) * scale);
    const right = Math.round((x + w - box.x) * scale);
    const top = Math.round((box.y + box.size - (y + h)) * scale);
    const bottom = Math.round((box.y + box.size - y) * scale);
    for (let row = top; row < bottom; row++) for (let col = left; col < right; col++) rgba.fill(0, (row * side + col) * 4, (row * side + col) * 4 + 3);
  }
  return { rects: rects.length, rgba, side };
}

// The first render loads and parses the fonts once; on a busy machine that takes a few seconds.
describe('renderCertificatePdf', { timeout: 30_000 }, () => {
  it('writes the serial, the name with its accents, the course, the program and the dates as text', async () => {
    const data = input();
    const bytes = await renderCertificatePdf(data);
    expect(Buffer.from(bytes.subarray(0, 5)).toString()).toBe('%PDF-');
    const parser = new PDFParse({ data: bytes });
    const { text } = await parser.getText();
    await parser.destroy();
    expect(text).toContain(data.serial);
    expect(text).toContain('Renée Dubois-Ñúñez');
    expect(text).toContain('Safe Pickling and Water-Bath Canning');
    expect(text).toContain('Cedar Hollow County home-preserving program');
    expect(text).toContain('December 1, 2026');
    expect(text).toContain('December 1, 2029');
  });

  it('embeds Merriweather (regular and bold) as a font subset', async () => {
    const bytes = await renderCertificatePdf(input());
    const doc = await PDFDocument.load(bytes);
    const names: string[] = [];
    doc.context.enumerateIndirectObjects().forEach(([, obj]) => {
      if (obj instanceof PDFDict && obj.get(PDFName.of('Type'))?.toString() === '/FontDescriptor') {
        names.push(obj.get(PDFName.of('FontName'))!.toString());
        expect(obj.get(PDFName.of('FontFile2'))).toBeDefined();
      }
    });
    expect(names.some((n) => /Merriweather/.test(n) && !/Bold/.test(n))).toBe(true);
    expect(names.some((n) => /Merriweather.*Bold/.test(n))).toBe(true);
  });

  it('draws a QR code that decodes (jsQR) to the verification URL, the same symbol qrPng makes', async () => {
    const data = input();
    const url = verificationUrl(data.appUrl, data.serial);
    expect(url).toBe(`http://127.0.0.1:3170/verify/${data.serial}`);

    const decoded = await sharp(await qrPng(url))
      .ensureAlpha()
      .raw()
      .toBuffer({ resolveWithObject: true });
    expect(jsQR(new Uint8ClampedArray(decoded.data), decoded.info.width, decoded.info.height)?.data).toBe(url);

    const content = await pageContent(await renderCertificatePdf(data));
    // The white square of the QR code, bottom right (614, 56, 118 pt): see pdf.ts.
    expect(content).toContain('1 0 0 1 614 56 cm');
    const qr = rasteriseQr(content, { x: 614, y: 56, size: 118 });
    expect(qr.rects).toBe(qrRuns(qrMatrix(url)).length);
    expect(jsQR(qr.rgba, qr.side, qr.side)?.data).toBe(url);
  });

  it('changes the QR code with the serial', async () => {
    const a = input();
    const b = { ...a, serial: generateSerial() };
    const qa = rasteriseQr(await pageContent(await renderCertificatePdf(a)), { x: 614, y: 56, size: 118 });
    const qb = rasteriseQr(await pageContent(await renderCertificatePdf(b)), { x: 614, y: 56, size: 118 });
    expect(jsQR(qb.rgba, qb.side, qb.side)?.data).toBe(verificationUrl(b.appUrl, b.serial));
    expect(jsQR(qa.rgba, qa.side, qa.side)?.data).not.toBe(jsQR(qb.rgba, qb.side, qb.side)?.data);
  });
});
