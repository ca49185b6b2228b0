import QRCode from 'qrcode';

/** The public page that checks a certificate, at the app's address. */
export function verificationUrl(appUrl: string, serial: string): string {
  return new URL(`/verify/${encodeURIComponent(serial)}`, appUrl).toString();
}

/**
 * The QR code (PNG) that opens the verification page. Error correction level M (about 15 % of the
 * symbol may be lost, ISO/IEC 18004), a quiet zone of 4 modules as the standard asks.
 */
export async function qrPng(url: string): Promise<Buffer> {
  return QRCode.toBuffer(url, { type: 'png', errorCorrectionLevel: 'M', margin: 4, scale: 6, color: { dark: '#1f2a2aff', light: '#ffffffff' } });
}
