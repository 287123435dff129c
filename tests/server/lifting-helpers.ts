import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { inflateSync } from 'node:zlib';

/** Text of a PDF as poppler's pdftotext reads it (layout order). */
export function pdfText(pdf: Buffer): string {
  const dir = mkdtempSync(join(tmpdir(), 'ballast-pdf-'));
  try {
    writeFileSync(join(dir, 'a.pdf'), pdf);
    return execFileSync('pdftotext', ['-layout', join(dir, 'a.pdf'), '-'], { encoding: 'utf8' });
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/**
 * Renders page 1 with `pdftoppm -png` and returns the share of pixels darker than light grey.
 * The PNG is decoded here (8-bit grey or RGB, the five PNG row filters) so the check needs no image library.
 */
export function pageOneInkShare(pdf: Buffer, dpi = 40): { share: number; width: number; height: number } {
  const dir = mkdtempSync(join(tmpdir(), 'ballast-png-'));
  try {
    writeFileSync(join(dir, 'a.pdf'), pdf);
    execFileSync('pdftoppm', ['-png', '-r', String(dpi), '-f', '1', '-l', '1', join(dir, 'a.pdf'), join(dir, 'p')]);
    const file = readdirSync(dir).find((f) => f.endsWith('.png'))!;
    return inkShare(readFileSync(join(dir, file)));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

function inkShare(png: Buffer): { share: number; width: number; height: number } {
  let off = 8;
  let width = 0;
  let height = 0;
  let bitDepth = 0;
  let colorType = 0;
  const idat: Buffer[] = [];
  while (off < png.length) {
    const len = png.readUInt32BE(off);
    const type = png.toString('ascii', off + 4, off + 8);
    const data = png.subarray(off + 8, off + 8 + len);
    if (type === 'IHDR') {
      width = data.readUInt32BE(0);
      height = data.readUInt32BE(4);
      bitDepth = data[8];
      colorType = data[9];
    } else if (type === 'IDAT') idat.push(data);
    off += 12 + len;
  }
  // 8-bit greyscale (0), RGB (2) or RGBA (6): bytes per pixel.
  const bpp = ({ 0: 1, 2: 3, 6: 4 } as Record<number, number>)[colorType];
  if (bitDepth !== 8 || !bpp) throw new Error(`expected an 8-bit grey or RGB PNG, got depth ${bitDepth} type ${colorType}`);
  const raw = inflateSync(Buffer.concat(idat));
  const stride = width * bpp;
  const out = Buffer.alloc(stride * height);
  for (let y = 0; y < height; y++) {
    const f = raw[y * (stride + 1)];
    for (let x = 0; x < stride; x++) {
      const v = raw[y * (stride + 1) + 1 + x];
      const a = x >= bpp ? out[y * stride + x - bpp] : 0;
      const b = y > 0 ? out[(y - 1) * stride + x] : 0;
      const c = x >= bpp && y > 0 ? out[(y - 1) * stride + x - bpp] : 0;
      let p: number;
      if (f === 0) p = v;
      else if (f === 1) p = v + a;
      else if (f === 2) p = v + b;
      else if (f === 3) p = v + ((a + b) >> 1);
      else {
        const pa = Math.abs(b - c);
        const pb = Math.abs(a - c);
        const pc = Math.abs(a + b - 2 * c);
        p = v + (pa <= pb && pa <= pc ? a : pb <= pc ? b : c);
      }
      out[y * stride + x] = p & 0xff;
    }
  }
  let dark = 0;
  for (let i = 0; i < width * height; i++) {
    // Mean of the colour channels is enough to tell ink from paper.
    let sum = 0;
    for (let k = 0; k < Math.min(bpp, 3); k++) sum += out[i * bpp + k];
    if (sum / Math.min(bpp, 3) < 200) dark++;
  }
  return { share: dark / (width * height), width, height };
}
