import fs from 'node:fs';
import path from 'node:path';
import * as fontkitModule from '@pdf-lib/fontkit';
import { PDFDocument, fill, popGraphicsState, pushGraphicsState, rectangle, rgb, setFillingRgbColor, type PDFFont, type PDFPage } from 'pdf-lib';
import { QUIET_ZONE, qrMatrix, qrRuns, verificationUrl } from './qr';
import { woffToSfnt } from './woff';

export type CertificatePdfInput = {
  holderName: string;
  courseTitle: string;
  programName: string;
  signerName?: string | null;
  signerTitle?: string | null;
  serial: string;
  issuedAt: Date;
  validUntil: Date;
  appUrl: string;
};

// The package's types name its exports, its ES build has only a default export: accept both.
const fontkit = ((fontkitModule as unknown as { default?: typeof fontkitModule }).default ?? fontkitModule) as typeof fontkitModule;

type FontkitFont = ReturnType<typeof fontkit.create>;
type FontFace = { bytes: Buffer; font: FontkitFont; covers: (codePoint: number) => boolean };
type FontSet = { regular: FontFace[]; bold: FontFace[] };

let fonts: FontSet | undefined;

function fontDir(): string {
  return path.join(process.env.BRINEWRIGHT_ROOT ?? process.cwd(), 'node_modules/@fontsource/merriweather/files');
}

function loadFace(file: string): FontFace {
  const bytes = woffToSfnt(fs.readFileSync(path.join(fontDir(), file)));
  const font = fontkit.create(bytes);
  // Text shaping (GSUB/GPOS lookups) is the next largest cost, and most lines of a certificate are
  // the same on every one: remember the last few hundred layouts. Glyph runs are only read.
  const layout = font.layout.bind(font);
  const memo = new Map<string, ReturnType<typeof layout>>();
  font.layout = ((text: string, features?: Parameters<typeof layout>[1]) => {
    const key = features ? `${JSON.stringify(features)}\u0000${text}` : text;
    let run = memo.get(key);
    if (!run) {
      run = layout(text, features);
      if (memo.size >= 500) memo.delete(memo.keys().next().value!);
      memo.set(key, run);
    }
    return run;
  }) as typeof font.layout;
  return { bytes, font, covers: (cp) => font.hasGlyphForCodePoint(cp) };
}

/** Merriweather 400 and 700, the latin subset first and latin-ext for names it does not cover. */
function fontSet(): FontSet {
  fonts ??= {
    regular: [loadFace('merriweather-latin-400-normal.woff'), loadFace('merriweather-latin-ext-400-normal.woff')],
    bold: [loadFace('merriweather-latin-700-normal.woff'), loadFace('merriweather-latin-ext-700-normal.woff')],
  };
  return fonts;
}

/**
 * pdf-lib asks fontkit to parse the font file again for every document, which is most of the time
 * a certificate takes. This fontkit hands back the font already parsed for the same bytes (the
 * parsed font is only read: pdf-lib makes a new subset of it per document).
 */
const cachingFontkit = {
  create(data: Uint8Array, postscriptName?: string): FontkitFont {
    const face = [...fontSet().regular, ...fontSet().bold].find(
      (f) => f.bytes.length === data.length && Buffer.compare(f.bytes, Buffer.from(data.buffer, data.byteOffset, data.byteLength)) === 0,
    );
    return face ? face.font : fontkit.create(data, postscriptName);
  },
};

const formatDate = (date: Date) => new Intl.DateTimeFormat('en-US', { dateStyle: 'long', timeZone: 'UTC' }).format(date);

const INK = rgb(0.12, 0.16, 0.16);
const BRINE = rgb(0.12, 0.37, 0.33);
const COPPER = rgb(0.72, 0.4, 0.18);

/**
 * Draws a QR symbol as vector rectangles (one per dark run of a row, black on a white square with
 * the quiet zone): sharp at any zoom or print size, and far cheaper than encoding and embedding a PNG.
 */
function drawQr(page: PDFPage, matrix: boolean[][], at: { x: number; y: number; size: number }) {
  const modules = matrix.length + 2 * QUIET_ZONE;
  const unit = at.size / modules;
  const round = (n: number) => Math.round(n * 1000) / 1000;
  page.drawRectangle({ x: at.x, y: at.y, width: at.size, height: at.size, color: rgb(1, 1, 1) });
  // One path of `re` rectangles and a single fill: a small content stream.
  page.pushOperators(
    pushGraphicsState(),
    setFillingRgbColor(0, 0, 0),
    ...qrRuns(matrix).map((run) =>
      rectangle(round(at.x + (run.col + QUIET_ZONE) * unit), round(at.y + at.size - (run.row + QUIET_ZONE + 1) * unit), round(run.length * unit), round(unit)),
    ),
    fill(),
    popGraphicsState(),
  );
}

/**
 * Renders the certificate: learner, course, program, dates, serial and a QR code to the
 * verification page. Merriweather is embedded as a subset (only the glyphs used).
 */
export async function renderCertificatePdf(input: CertificatePdfInput): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.registerFontkit(cachingFontkit);
  doc.setTitle(`Certificate ${input.serial}`);
  doc.setSubject(`${input.courseTitle}: ${input.holderName}`);
  doc.setProducer('Brinewright');
  doc.setCreator('Brinewright certificate desk');
  const set = fontSet();
  const embedded = new Map<Buffer, PDFFont>();
  const pick = async (faces: FontFace[], text: string): Promise<{ font: PDFFont; text: string }> => {
    const codePoints = [...text].map((c) => c.codePointAt(0)!);
    const face = faces.find((f) => codePoints.every((cp) => cp <= 32 || f.covers(cp))) ?? faces[0];
    let font = embedded.get(face.bytes);
    if (!font) {
      font = await doc.embedFont(face.bytes, { subset: true });
      embedded.set(face.bytes, font);
    }
    // A character no Merriweather subset has would print as an empty box: show '?' instead.
    const safe = [...text].map((c) => (c.codePointAt(0)! <= 32 || face.covers(c.codePointAt(0)!) ? c : '?')).join('');
    return { font, text: safe };
  };

  const page = doc.addPage([792, 612]); // US Letter, landscape, in points
  const { width, height } = page.getSize();
  page.drawRectangle({ x: 24, y: 24, width: width - 48, height: height - 48, borderColor: BRINE, borderWidth: 3 });
  page.drawRectangle({ x: 34, y: 34, width: width - 68, height: height - 68, borderColor: COPPER, borderWidth: 0.8 });

  const centred = async (faces: FontFace[], raw: string, y: number, size: number, color = INK, maxWidth = width - 140) => {
    const { font, text } = await pick(faces, raw);
    // Widths scale with the size: measure once, shrink a long name to fit, centre it.
    const unitWidth = font.widthOfTextAtSize(text, 1);
    const s = Math.max(8, Math.min(size, Math.floor(maxWidth / unitWidth)));
    page.drawText(text, { x: (width - unitWidth * s) / 2, y, size: s, font, color });
  };

  await centred(set.regular, input.programName, height - 92, 14, BRINE);
  await centred(set.bold, 'Certificate of completion', height - 140, 30, INK);
  await centred(set.regular, 'This certifies that', height - 190, 13);
  await centred(set.bold, input.holderName, height - 232, 28, BRINE);
  await centred(set.regular, 'has completed the course', height - 268, 13);
  await centred(set.bold, input.courseTitle, height - 302, 18);
  await centred(set.regular, `Issued ${formatDate(input.issuedAt)}  ·  Valid until ${formatDate(input.validUntil)}`, height - 344, 12);
  if (input.signerName)
    await centred(set.regular, `Signed by ${input.signerName}${input.signerTitle ? `, ${input.signerTitle}` : ''}`, height - 372, 11, INK, width - 380);

  const url = verificationUrl(input.appUrl, input.serial);
  drawQr(page, qrMatrix(url), { x: width - 60 - 118, y: 56, size: 118 });

  const left = async (faces: FontFace[], raw: string, y: number, size: number, color = INK) => {
    const { font, text } = await pick(faces, raw);
    page.drawText(text, { x: 64, y, size, font, color });
  };
  await left(set.regular, 'Serial', 150, 10, BRINE);
  await left(set.bold, input.serial, 132, 16);
  await left(set.regular, 'Check this certificate by scanning the code or at', 108, 9);
  await left(set.regular, url, 94, 9, BRINE);
  await left(set.regular, 'This records completed training. It does not certify any recipe or product as safe;', 70, 8);
  await left(set.regular, 'follow tested recipes, local codes and licensed practice.', 59, 8);

  return doc.save({ useObjectStreams: false });
}
