import { COLORS, type PdfWriter } from './document.ts';

/**
 * Handling marks in the manner of ISO 780:2015: black symbols on a white ground, shown only where they
 * apply. These are Ballast's own vector drawings of each mark's meaning (arrows for "this way up", a
 * goblet for "fragile", an umbrella for "keep dry", the quartered circle for the centre of gravity, a
 * crossed hook, a chain for "sling here", a loaded box for the stacking limit); no published artwork is
 * reproduced. Which marks a crate carries is decided by the documents service; this file only draws.
 *
 * ISO 780:2015 gives 100, 150 and 200 mm as the normal symbol heights (REFERENCES §4.3 [S]); paper
 * documents draw them at 100 mm where there is room, proportionally smaller where there is not.
 */

export type HandlingMarkKind =
  | 'this-way-up'
  | 'fragile'
  | 'keep-dry'
  | 'centre-of-gravity'
  | 'no-hooks'
  | 'sling-here'
  | 'stacking-limit'
  | 'do-not-stack';

export interface HandlingMark {
  kind: HandlingMarkKind;
  /** Words under the symbol, e.g. "This way up". */
  caption: string;
  /** A figure drawn inside the symbol (the stacking limit, e.g. "60 kg"). */
  figure?: string;
  /** Why the mark applies, for the packing list. */
  reason: string;
}

/** Points per millimetre (PDF user space is 1/72 in). */
export const PT_PER_MM = 72 / 25.4;
export const mmToPt = (mm: number): number => mm * PT_PER_MM;

/** The normal symbol heights of ISO 780:2015, mm (REFERENCES §4.3 [S]). */
export const ISO780_SYMBOL_HEIGHTS_MM = [100, 150, 200] as const;

/**
 * The largest symbol size (pt) not above `preferredMm` at which `count` marks with their gaps fit in one
 * row of `availablePt`: 100 mm where it fits, otherwise the whole row scaled down proportionally.
 */
export function markSizeToFit(availablePt: number, count: number, preferredMm: number = ISO780_SYMBOL_HEIGHTS_MM[0], gapShare = 0.12): number {
  const preferred = mmToPt(preferredMm);
  if (count <= 0) return preferred;
  const fit = availablePt / (count + (count - 1) * gapShare);
  return Math.min(preferred, fit);
}

type Doc = PDFKit.PDFDocument;
const INK = '#000000';

/**
 * Draws one mark in a square of `sizePt` whose top-left corner is (x, y). The drawing is made in a
 * 100 × 100 box (y down) and scaled, so line weights scale with the symbol.
 */
export function drawHandlingMark(doc: Doc, mark: HandlingMark, x: number, y: number, sizePt: number, opts: { frame?: boolean } = {}): void {
  doc.save();
  doc.translate(x, y).scale(sizePt / 100);
  if (opts.frame ?? true) doc.rect(1, 1, 98, 98).lineWidth(1.2).strokeColor(INK).stroke();
  doc.fillColor(INK).strokeColor(INK).lineCap('butt').lineJoin('miter');
  switch (mark.kind) {
    case 'this-way-up':
      thisWayUp(doc);
      break;
    case 'fragile':
      fragile(doc);
      break;
    case 'keep-dry':
      keepDry(doc);
      break;
    case 'centre-of-gravity':
      centreOfGravity(doc, 50, 50, 30);
      break;
    case 'no-hooks':
      noHooks(doc);
      break;
    case 'sling-here':
      slingHere(doc);
      break;
    case 'stacking-limit':
      stackingLimit(doc, mark.figure);
      break;
    case 'do-not-stack':
      doNotStack(doc);
      break;
  }
  doc.restore();
}

/** Two upward arrows standing on a bar. */
function thisWayUp(doc: Doc): void {
  for (const cx of [33, 67]) {
    doc.rect(cx - 4.5, 36, 9, 44).fill(INK);
    doc.polygon([cx - 15, 40], [cx, 12], [cx + 15, 40]).fill(INK);
  }
  doc.rect(14, 84, 72, 6).fill(INK);
}

/** A stemmed goblet with a crack through its bowl. */
function fragile(doc: Doc): void {
  doc.path('M 30 10 L 70 10 C 71 42 62 54 54 57 L 54 79 L 68 86 L 68 90 L 32 90 L 32 86 L 46 79 L 46 57 C 38 54 29 42 30 10 Z').fill(INK);
  doc.path('M 45 12 L 53 25 L 45 34 L 55 47').lineWidth(3.2).strokeColor('#ffffff').stroke();
}

/** An umbrella with rain falling on it. */
function keepDry(doc: Doc): void {
  doc.path('M 16 58 A 34 34 0 0 1 84 58 Z').fill(INK);
  // Scalloped hem: white bites out of the canopy's edge.
  for (const cx of [27.3, 50, 72.7]) doc.circle(cx, 58, 11.3).fill('#ffffff');
  doc.path('M 50 30 L 50 84 A 7 7 0 0 1 36 84').lineWidth(4.5).strokeColor(INK).stroke();
  for (const [dx, dy] of [
    [22, 12],
    [50, 6],
    [78, 12],
  ] as const) {
    doc.path(`M ${dx} ${dy - 6} C ${dx + 4.5} ${dy} ${dx + 4.5} ${dy + 5} ${dx} ${dy + 5} C ${dx - 4.5} ${dy + 5} ${dx - 4.5} ${dy} ${dx} ${dy - 6} Z`).fill(INK);
  }
}

/**
 * The centre-of-gravity symbol: a circle with two opposite quarters filled, and short vertical ticks
 * above and below it that a crate's painter extends to the CoG line. Exported for labels and views.
 */
export function centreOfGravity(doc: Doc, cx: number, cy: number, r: number): void {
  doc.circle(cx, cy, r).lineWidth(r * 0.13).strokeColor(INK).stroke();
  doc.path(`M ${cx} ${cy} L ${cx + r} ${cy} A ${r} ${r} 0 0 1 ${cx} ${cy + r} Z`).fill(INK);
  doc.path(`M ${cx} ${cy} L ${cx - r} ${cy} A ${r} ${r} 0 0 1 ${cx} ${cy - r} Z`).fill(INK);
  doc.moveTo(cx, cy - r * 1.45).lineTo(cx, cy - r).lineWidth(r * 0.13).stroke();
  doc.moveTo(cx, cy + r).lineTo(cx, cy + r * 1.45).lineWidth(r * 0.13).stroke();
}

/** A crane hook, struck through. */
function noHooks(doc: Doc): void {
  doc.path('M 50 12 L 50 52 A 15 15 0 1 1 26 62').lineWidth(7).strokeColor(INK).stroke();
  doc.polygon([20, 56], [32, 58], [24, 68]).fill(INK);
  doc.circle(50, 12, 5).lineWidth(4).stroke();
  doc.moveTo(14, 14).lineTo(86, 86).lineWidth(7).stroke();
  doc.moveTo(86, 14).lineTo(14, 86).lineWidth(7).stroke();
}

/** Three chain links, the middle one seen edge-on. */
function slingHere(doc: Doc): void {
  doc.ellipse(50, 22, 11, 16).lineWidth(6).strokeColor(INK).stroke();
  doc.rect(47, 34, 6, 32).fill(INK);
  doc.ellipse(50, 78, 11, 16).lineWidth(6).stroke();
}

/** A box under a load plate with the largest mass that may stand on it. */
function stackingLimit(doc: Doc, figure?: string): void {
  doc.rect(20, 50, 60, 42).lineWidth(4).strokeColor(INK).stroke();
  doc.rect(12, 40, 76, 6).fill(INK);
  doc.rect(47, 8, 6, 20).fill(INK);
  doc.polygon([40, 26], [60, 26], [50, 38]).fill(INK);
  if (figure) {
    doc.font('bold').fontSize(figure.length > 7 ? 10 : 13).fillColor(INK).text(figure, 22, 64, { width: 56, align: 'center', lineBreak: false });
  }
}

/** A box with a crossed-out box standing on it. */
function doNotStack(doc: Doc): void {
  doc.rect(22, 58, 56, 34).lineWidth(4).strokeColor(INK).stroke();
  doc.rect(30, 14, 40, 34).lineWidth(4).stroke();
  doc.moveTo(20, 8).lineTo(80, 54).lineWidth(6).stroke();
  doc.moveTo(80, 8).lineTo(20, 54).lineWidth(6).stroke();
}

/**
 * The largest symbol size for `count` marks in a box of `widthPt` × `heightPt`, at most `preferredPt`,
 * trying every number of marks per row; each mark takes `captionPt` under it and gaps of `gapShare` of
 * its size between. Proportional scaling, as ISO 780 symbols may be drawn smaller on small packages.
 */
export function marksGrid(count: number, widthPt: number, heightPt: number, preferredPt: number, captionPt = 14, gapShare = 0.12): { sizePt: number; perRow: number; gapPt: number } {
  let best = { sizePt: 0, perRow: Math.max(count, 1), gapPt: 0 };
  for (let perRow = 1; perRow <= Math.max(count, 1); perRow++) {
    const rows = Math.ceil(count / perRow);
    const byWidth = widthPt / (perRow + (perRow - 1) * gapShare);
    const byHeight = (heightPt - rows * captionPt) / (rows + (rows - 1) * gapShare);
    const size = Math.min(preferredPt, byWidth, byHeight);
    if (size > best.sizePt + 0.01) best = { sizePt: size, perRow, gapPt: size * gapShare };
  }
  return best;
}

/**
 * A row of marks across the page at one size (at most `preferredMm`, smaller when they do not fit in one
 * row), captions under each. Returns the symbol size used, pt.
 */
export function handlingMarksRow(w: PdfWriter, marks: readonly HandlingMark[], opts: { preferredMm?: number } = {}): number {
  if (marks.length === 0) return 0;
  const size = markSizeToFit(w.width, marks.length, opts.preferredMm);
  const gap = marks.length > 1 ? Math.min(size * 0.5, (w.width - marks.length * size) / (marks.length - 1)) : 0;
  const captionH = 24;
  w.ensureSpace(size + captionH + 4);
  const y = w.doc.y;
  marks.forEach((m, i) => {
    const x = w.left + i * (size + gap);
    drawHandlingMark(w.doc, m, x, y, size);
    w.doc
      .font('bold')
      .fontSize(8)
      .fillColor(COLORS.ink)
      .text(m.caption, x - 4, y + size + 3, { width: size + 8, align: 'center', height: captionH, ellipsis: true });
  });
  w.doc.x = w.left;
  w.doc.y = y + size + captionH;
  w.doc.font('regular').fontSize(10).fillColor(COLORS.ink);
  return size;
}
