import QRCode from 'qrcode';

/**
 * QR codes for labels (qrcode package), error correction level M (about 15 % of the symbol may be lost:
 * a scuffed label still reads) with the standard four-module quiet zone (ISO/IEC 18004).
 *
 * Labels draw the code as vector squares (`drawQr`): crisp at any print size, and about a hundred times
 * faster than encoding a PNG per label (qrcode's PNG writer runs pngjs, about 100 ms a code), which
 * matters when a whole tour's labels are printed at once. `qrPng` is kept for a bitmap where one is
 * needed.
 */
export async function qrPng(text: string, pixelsPerModule = 10): Promise<Buffer> {
  return QRCode.toBuffer(text, { type: 'png', errorCorrectionLevel: 'M', margin: 4, scale: pixelsPerModule, color: { dark: '#000000', light: '#ffffff' } });
}

/** The code's modules: `size` × `size`, dark where true (quiet zone not included). */
export function qrModules(text: string): { size: number; dark: (row: number, col: number) => boolean } {
  const qr = QRCode.create(text, { errorCorrectionLevel: 'M' });
  const { size, data } = qr.modules;
  return { size, dark: (row, col) => data[row * size + col] === 1 };
}

/** Draws the code in a white square of `sizePt` at (x, y), quiet zone included; one path, dark runs merged per row. */
export function drawQr(doc: PDFKit.PDFDocument, text: string, x: number, y: number, sizePt: number): void {
  const m = qrModules(text);
  const quiet = 4;
  const unit = sizePt / (m.size + 2 * quiet);
  doc.save().rect(x, y, sizePt, sizePt).fill('#ffffff');
  for (let r = 0; r < m.size; r++) {
    let c = 0;
    while (c < m.size) {
      if (!m.dark(r, c)) {
        c++;
        continue;
      }
      const start = c;
      while (c < m.size && m.dark(r, c)) c++;
      // A hair of overlap so that no white seams show between neighbouring squares.
      doc.rect(x + (quiet + start) * unit, y + (quiet + r) * unit, (c - start) * unit + 0.05, unit + 0.05);
    }
  }
  doc.fill('#000000').restore();
}
