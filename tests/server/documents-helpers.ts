import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** Runs `fn` with the PDF written to a temporary folder, then removes the folder. */
function withPdf<T>(pdf: Buffer, fn: (dir: string, file: string) => T): T {
  const dir = mkdtempSync(join(tmpdir(), 'ballast-doc-'));
  try {
    const file = join(dir, 'a.pdf');
    writeFileSync(file, pdf);
    return fn(dir, file);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Each page's size in points as poppler's pdfinfo reports it. */
export function pdfPageSizes(pdf: Buffer): { widthPt: number; heightPt: number }[] {
  return withPdf(pdf, (_dir, file) => {
    const out = execFileSync('pdfinfo', ['-f', '1', '-l', '9999', file], { encoding: 'utf8' });
    return [...out.matchAll(/^Page\s+\d+\s+size:\s+([\d.]+) x ([\d.]+) pts/gm)].map((m) => ({ widthPt: Number(m[1]), heightPt: Number(m[2]) }));
  });
}

/** A page rendered by pdftoppm in 8-bit grey (PGM, binary P5: a short text header and one byte per pixel). */
export function renderGray(pdf: Buffer, page = 1, dpi = 40): { width: number; height: number; data: Uint8Array } {
  return withPdf(pdf, (dir, file) => {
    execFileSync('pdftoppm', ['-gray', '-r', String(dpi), '-f', String(page), '-l', String(page), file, join(dir, 'p')]);
    const name = readdirSync(dir).find((f) => f.endsWith('.pgm'))!;
    const buf = readFileSync(join(dir, name));
    // Header: "P5", width, height, maxval, each separated by whitespace, then one whitespace byte.
    let off = 0;
    const fields: string[] = [];
    while (fields.length < 4) {
      while (/\s/.test(String.fromCharCode(buf[off]))) off++;
      let s = '';
      while (!/\s/.test(String.fromCharCode(buf[off]))) s += String.fromCharCode(buf[off++]);
      fields.push(s);
    }
    off++;
    if (fields[0] !== 'P5' || fields[3] !== '255') throw new Error(`expected an 8-bit binary PGM, got ${fields.join(' ')}`);
    const width = Number(fields[1]);
    const height = Number(fields[2]);
    return { width, height, data: new Uint8Array(buf.subarray(off, off + width * height)) };
  });
}

/** Share of pixels darker than light grey on a rendered page: 0 for a blank page. */
export function inkShare(img: { data: Uint8Array }): number {
  let dark = 0;
  for (const v of img.data) if (v < 200) dark++;
  return dark / img.data.length;
}

interface ZxingResult {
  getText(): string;
}
interface Zxing {
  RGBLuminanceSource: new (lum: Uint8ClampedArray, w: number, h: number) => unknown;
  HybridBinarizer: new (src: unknown) => unknown;
  BinaryBitmap: new (b: unknown) => unknown;
  QRCodeReader: new () => { decode(bitmap: unknown): ZxingResult };
}

/**
 * Decodes the QR code on a rendered page with ZXing (the decoder html5-qrcode ships for the phone's
 * check-in camera): an independent reader, not the library that drew the code.
 */
export function decodeQr(img: { width: number; height: number; data: Uint8Array }): string {
  const require = createRequire(import.meta.url);
  const z = require('html5-qrcode/third_party/zxing-js.umd.js') as Zxing;
  const source = new z.RGBLuminanceSource(new Uint8ClampedArray(img.data), img.width, img.height);
  return new z.QRCodeReader().decode(new z.BinaryBitmap(new z.HybridBinarizer(source))).getText();
}
