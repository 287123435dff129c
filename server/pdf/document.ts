import { createRequire } from 'node:module';
import { readFileSync } from 'node:fs';
import PDFDocument from 'pdfkit';

/**
 * Shared PDF building blocks for every Ballast printout (lift plans, packing lists, labels, manifests):
 * a page of the production's paper size with Barlow embedded from full TTFs (the web subsets lack
 * many European letters and their WOFF2 files break pdfkit on accented glyphs), running header and
 * footer with page numbers, and text, table and key/value helpers that break pages by themselves.
 * Renderers only lay out what the core computed; no figure is worked out here.
 */

export type PaperSize = 'A4' | 'Letter';

const require = createRequire(import.meta.url);
let fontCache: { regular: Buffer; bold: Buffer } | null = null;

/** Barlow regular and bold, read once. */
export function barlowFonts(): { regular: Buffer; bold: Buffer } {
  fontCache ??= {
    regular: readFileSync(require.resolve('@expo-google-fonts/barlow/400Regular/Barlow_400Regular.ttf')),
    bold: readFileSync(require.resolve('@expo-google-fonts/barlow/700Bold/Barlow_700Bold.ttf')),
  };
  return fontCache;
}

export const COLORS = {
  ink: '#1b232b',
  muted: '#56616c',
  rule: '#c5ccd3',
  accent: '#1f6f8b',
  danger: '#a3261b',
  caution: '#8a5a00',
  cautionFill: '#fff4dc',
  ok: '#2a6b35',
} as const;

export interface PdfOptions {
  paperSize: PaperSize;
  /** Document title: in the metadata and the running header. */
  title: string;
  /** Right side of the running header (e.g. the production's name). */
  headerRight?: string;
  /** Left side of the footer (e.g. "Printed 2027-01-20 by …"). */
  footerLeft?: string;
  author?: string;
}

type Align = 'left' | 'right' | 'center';

export interface TableColumn {
  header: string;
  /** Share of the text width (the shares are scaled to fill it). */
  width: number;
  align?: Align;
}

/** Characters Barlow has no glyph for, as words or ASCII, so no text prints as empty boxes. */
const MISSING_GLYPHS: Record<string, string> = { '→': '->', '←': '<-', '↑': 'up', '↓': 'down', θ: 'theta', φ: 'phi', β: 'beta', Σ: 'sum' };

/** Text as Barlow can print it. */
export function pdfSafe(text: string): string {
  return text.replace(/[→←↑↓θφβΣ]/g, (c) => MISSING_GLYPHS[c] ?? '?');
}

/** Shortens a one-line text with an ellipsis until it fits the width in the current font. */
export function fit(doc: PDFKit.PDFDocument, text: string, widthPt: number): string {
  if (doc.widthOfString(text) <= widthPt) return text;
  let s = text;
  while (s.length > 1 && doc.widthOfString(`${s}…`) > widthPt) s = s.slice(0, -1);
  return `${s.trimEnd()}…`;
}

/** One page flow of a Ballast document. */
export class PdfWriter {
  readonly doc: PDFKit.PDFDocument;
  readonly opts: PdfOptions;
  private readonly chunks: Buffer[] = [];
  private readonly done: Promise<Buffer>;

  constructor(opts: PdfOptions) {
    this.opts = opts;
    this.doc = new PDFDocument({
      size: opts.paperSize === 'Letter' ? 'LETTER' : 'A4',
      margins: { top: 62, bottom: 58, left: 50, right: 50 },
      bufferPages: true,
      info: { Title: opts.title, Author: opts.author ?? 'Ballast', Creator: 'Ballast' },
    });
    const f = barlowFonts();
    this.doc.registerFont('regular', f.regular);
    this.doc.registerFont('bold', f.bold);
    this.doc.font('regular').fontSize(10).fillColor(COLORS.ink);
    this.done = new Promise((resolve, reject) => {
      this.doc.on('data', (c: Buffer) => this.chunks.push(c));
      this.doc.on('end', () => resolve(Buffer.concat(this.chunks)));
      this.doc.on('error', reject);
    });
  }

  get left(): number {
    return this.doc.page.margins.left;
  }
  get width(): number {
    return this.doc.page.width - this.doc.page.margins.left - this.doc.page.margins.right;
  }
  get bottom(): number {
    return this.doc.page.height - this.doc.page.margins.bottom;
  }

  /** Starts a new page unless `heightPt` still fits on this one. */
  ensureSpace(heightPt: number): void {
    if (this.doc.y + heightPt > this.bottom) this.doc.addPage();
  }

  title(text: string, sub?: string): void {
    this.doc.font('bold').fontSize(18).fillColor(COLORS.ink).text(pdfSafe(text), this.left, this.doc.y, { width: this.width });
    if (sub) this.doc.font('regular').fontSize(10.5).fillColor(COLORS.muted).text(pdfSafe(sub), { width: this.width });
    this.doc.moveDown(0.6).fillColor(COLORS.ink);
  }

  heading(text: string): void {
    this.ensureSpace(48);
    this.doc.moveDown(0.5);
    const y = this.doc.y;
    this.doc.font('bold').fontSize(12.5).fillColor(COLORS.accent).text(pdfSafe(text), this.left, y, { width: this.width });
    this.doc
      .moveTo(this.left, this.doc.y + 1)
      .lineTo(this.left + this.width, this.doc.y + 1)
      .lineWidth(0.6)
      .strokeColor(COLORS.rule)
      .stroke();
    this.doc.moveDown(0.4).font('regular').fontSize(10).fillColor(COLORS.ink);
  }

  paragraph(raw: string, opts: { bold?: boolean; color?: string; size?: number } = {}): void {
    const text = pdfSafe(raw);
    this.doc
      .font(opts.bold ? 'bold' : 'regular')
      .fontSize(opts.size ?? 10)
      .fillColor(opts.color ?? COLORS.ink);
    this.ensureSpace(this.doc.heightOfString(text, { width: this.width }) + 2);
    this.doc.text(text, this.left, this.doc.y, { width: this.width });
    this.doc.moveDown(0.3).fillColor(COLORS.ink).font('regular').fontSize(10);
  }

  bullets(items: string[], opts: { color?: string } = {}): void {
    this.doc.font('regular').fontSize(10).fillColor(opts.color ?? COLORS.ink);
    for (const item of items.map(pdfSafe)) {
      const h = this.doc.heightOfString(item, { width: this.width - 14 });
      this.ensureSpace(h + 2);
      const y = this.doc.y;
      this.doc.text('•', this.left, y, { width: 10 });
      this.doc.text(item, this.left + 14, y, { width: this.width - 14 });
      this.doc.moveDown(0.15);
    }
    this.doc.fillColor(COLORS.ink);
  }

  /** Two columns: label and value. */
  keyValues(rows: [string, string][], labelShare = 0.34): void {
    const lw = this.width * labelShare;
    for (const [k, v] of rows.map(([a, b]) => [pdfSafe(a), pdfSafe(b)])) {
      this.doc.font('regular').fontSize(10);
      const h = Math.max(this.doc.heightOfString(k, { width: lw - 8 }), this.doc.heightOfString(v, { width: this.width - lw }));
      this.ensureSpace(h + 3);
      const y = this.doc.y;
      this.doc.fillColor(COLORS.muted).text(k, this.left, y, { width: lw - 8 });
      this.doc.fillColor(COLORS.ink).text(v, this.left + lw, y, { width: this.width - lw });
      this.doc.y = y + h + 3;
    }
  }

  /** A table with a header row, repeated on each new page; rows grow to fit their text. */
  table(columns: TableColumn[], rows: string[][], opts: { rowColor?: (row: number) => string | undefined } = {}): void {
    const total = columns.reduce((a, c) => a + c.width, 0);
    const widths = columns.map((c) => (c.width / total) * this.width);
    const pad = 3;
    const drawRow = (raw: string[], bold: boolean, color: string) => {
      const cells = raw.map(pdfSafe);
      this.doc.font(bold ? 'bold' : 'regular').fontSize(9);
      const h = Math.max(...cells.map((c, i) => this.doc.heightOfString(c, { width: widths[i] - 2 * pad }))) + 2 * pad;
      return { h, draw: (y: number) => {
        let x = this.left;
        cells.forEach((c, i) => {
          this.doc.fillColor(color).text(c, x + pad, y + pad, { width: widths[i] - 2 * pad, align: columns[i].align ?? 'left' });
          x += widths[i];
        });
        this.doc.moveTo(this.left, y + h).lineTo(this.left + this.width, y + h).lineWidth(0.4).strokeColor(COLORS.rule).stroke();
      } };
    };
    const header = () => {
      const r = drawRow(columns.map((c) => c.header), true, COLORS.muted);
      const y = this.doc.y;
      r.draw(y);
      this.doc.y = y + r.h;
    };
    this.ensureSpace(40);
    header();
    rows.forEach((cells, i) => {
      const r = drawRow(cells, false, opts.rowColor?.(i) ?? COLORS.ink);
      if (this.doc.y + r.h > this.bottom) {
        this.doc.addPage();
        header();
        drawRow(cells, false, opts.rowColor?.(i) ?? COLORS.ink);
      }
      const y = this.doc.y;
      r.draw(y);
      this.doc.y = y + r.h;
    });
    this.doc.moveDown(0.5).font('regular').fontSize(10).fillColor(COLORS.ink);
  }

  /** Running header and footer with "page n of N" on every page; then the finished file. */
  async finish(): Promise<Buffer> {
    const range = this.doc.bufferedPageRange();
    for (let i = range.start; i < range.start + range.count; i++) {
      this.doc.switchToPage(i);
      const { left, right, top, bottom } = this.doc.page.margins;
      const w = this.doc.page.width - left - right;
      // Text in the margins must not trigger pdfkit's automatic page break.
      this.doc.page.margins = { left, right, top: 0, bottom: 0 };
      this.doc.font('bold').fontSize(8.5).fillColor(COLORS.muted).text(fit(this.doc, `BALLAST · ${this.opts.title}`, w * 0.6), left, top - 30, { width: w * 0.6, lineBreak: false });
      if (this.opts.headerRight) this.doc.font('regular').text(fit(this.doc, this.opts.headerRight, w * 0.4 - 6), left + w * 0.6, top - 30, { width: w * 0.4, align: 'right', lineBreak: false });
      const fy = this.doc.page.height - bottom + 22;
      if (this.opts.footerLeft) this.doc.font('regular').fontSize(8).text(fit(this.doc, this.opts.footerLeft, w * 0.75 - 6), left, fy, { width: w * 0.75, lineBreak: false });
      this.doc.font('regular').fontSize(8).text(`Page ${i - range.start + 1} of ${range.count}`, left + w * 0.75, fy, { width: w * 0.25, align: 'right', lineBreak: false });
      this.doc.page.margins = { left, right, top, bottom };
    }
    this.doc.end();
    return this.done;
  }
}
