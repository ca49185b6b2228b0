import { inflateSync } from 'node:zlib';
import jsQR from 'jsqr';
import { PDFDocument, PDFName, PDFRawStream, PDFDict, PDFNumber } from 'pdf-lib';
import { PDFParse } from 'pdf-parse';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { renderCertificatePdf } from './pdf';
import { qrPng, verificationUrl } from './qr';
import { generateSerial } from './serial';

const input = () => ({
  learnerName: 'Renée Dubois-Ñúñez',
  courseTitle: 'Safe Pickling and Water-Bath Canning',
  programName: 'Cedar Hollow County home-preserving program',
  serial: generateSerial(),
  issuedAt: new Date('2026-12-01T10:00:00Z'),
  validUntil: new Date('2029-12-01T10:00:00Z'),
  appUrl: 'http://127.0.0.1:3170',
});

/** Decodes the pixels of the first image XObject of page 1 (pdf-lib stores PNGs as Flate RGB). */
async function firstImage(bytes: Uint8Array): Promise<{ width: number; height: number; rgba: Uint8ClampedArray }> {
  const doc = await PDFDocument.load(bytes);
  const resources = doc.getPage(0).node.Resources()!;
  const xobjects = resources.lookup(PDFName.of('XObject'), PDFDict);
  for (const [, ref] of xobjects.entries()) {
    const stream = doc.context.lookup(ref);
    if (!(stream instanceof PDFRawStream)) continue;
    if (stream.dict.get(PDFName.of('Subtype'))?.toString() !== '/Image') continue;
    const width = (stream.dict.get(PDFName.of('Width')) as PDFNumber).asNumber();
    const height = (stream.dict.get(PDFName.of('Height')) as PDFNumber).asNumber();
    const raw = inflateSync(stream.contents);
    const channels = raw.length / (width * height);
    const rgba = new Uint8ClampedArray(width * height * 4);
    for (let i = 0; i < width * height; i++) {
      const v = raw.subarray(i * channels, i * channels + channels);
      rgba.set(channels >= 3 ? [v[0], v[1], v[2], 255] : [v[0], v[0], v[0], 255], i * 4);
    }
    return { width, height, rgba };
  }
  throw new Error('no image in the PDF');
}

describe('renderCertificatePdf', () => {
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

  it('embeds a QR code that decodes (jsQR) to the verification URL, the same image qrPng makes', async () => {
    const data = input();
    const url = verificationUrl(data.appUrl, data.serial);
    expect(url).toBe(`http://127.0.0.1:3170/verify/${data.serial}`);

    const decoded = await sharp(await qrPng(url)).ensureAlpha().raw().toBuffer({ resolveWithObject: true });
    const png = { width: decoded.info.width, height: decoded.info.height };
    const fromPng = jsQR(new Uint8ClampedArray(decoded.data), png.width, png.height);
    expect(fromPng?.data).toBe(url);

    const image = await firstImage(await renderCertificatePdf(data));
    expect([image.width, image.height]).toEqual([png.width, png.height]);
    const fromPdf = jsQR(image.rgba, image.width, image.height);
    expect(fromPdf?.data).toBe(url);
  });
});
