import QRCode from 'qrcode';

/** The public page that checks a certificate, at the app's address. */
export function verificationUrl(appUrl: string, serial: string): string {
  return new URL(`/verify/${encodeURIComponent(serial)}`, appUrl).toString();
}

// Error correction level M (about 15 % of the symbol may be lost) and a quiet zone of 4 modules,
// as ISO/IEC 18004 asks.
const OPTIONS = { errorCorrectionLevel: 'M' as const };
export const QUIET_ZONE = 4;

/** The QR symbol's modules (true = dark), row by row, from the qrcode package. */
export function qrMatrix(url: string): boolean[][] {
  const { modules } = QRCode.create(url, OPTIONS);
  return Array.from({ length: modules.size }, (_, row) => Array.from({ length: modules.size }, (_, col) => Boolean(modules.get(row, col))));
}

/** Dark runs of each row as rectangles in module units: what the PDF draws, one rectangle a run. */
export function qrRuns(matrix: boolean[][]): { row: number; col: number; length: number }[] {
  const runs: { row: number; col: number; length: number }[] = [];
  matrix.forEach((line, row) => {
    let col = 0;
    while (col < line.length) {
      if (!line[col]) {
        col++;
        continue;
      }
      const start = col;
      while (col < line.length && line[col]) col++;
      runs.push({ row, col: start, length: col - start });
    }
  });
  return runs;
}

/** The same QR code as a PNG image (for e-mail or a page), from the same qrcode options. */
export async function qrPng(url: string): Promise<Buffer> {
  return QRCode.toBuffer(url, { ...OPTIONS, type: 'png', margin: QUIET_ZONE, scale: 6, color: { dark: '#1f2a2aff', light: '#ffffffff' } });
}
