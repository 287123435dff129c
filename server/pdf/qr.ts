import QRCode from 'qrcode';

/**
 * A QR code as a PNG (qrcode package), for pdfkit to embed. Error correction level M (about 15 % of the
 * symbol may be lost: a scuffed label still reads) and the standard four-module quiet zone (ISO/IEC
 * 18004), drawn at `pixelsPerModule` so that the printed modules stay crisp.
 */
export async function qrPng(text: string, pixelsPerModule = 10): Promise<Buffer> {
  return QRCode.toBuffer(text, { type: 'png', errorCorrectionLevel: 'M', margin: 4, scale: pixelsPerModule, color: { dark: '#000000', light: '#ffffff' } });
}
