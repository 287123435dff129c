import { COLORS, pdfSafe, type PdfWriter } from './document.ts';

/**
 * The cautions block every printout with a lifting verdict carries: a framed box, never split across
 * pages, listing the cautions the core attached to the verdict (pass them in; the wording is the
 * core's, so screens and paper say the same thing).
 */
export function cautionsBlock(w: PdfWriter, given: readonly string[], title = 'Cautions'): void {
  const cautions = given.map(pdfSafe);
  const { doc } = w;
  const pad = 8;
  const inner = w.width - 2 * pad - 14;
  doc.font('regular').fontSize(10);
  const textH = cautions.reduce((a, c) => a + doc.heightOfString(c, { width: inner }) + 3, 0);
  const h = textH + 2 * pad + 18;
  w.ensureSpace(h + 6);
  const x = w.left;
  const y = doc.y;
  doc.save().rect(x, y, w.width, h).fillAndStroke(COLORS.cautionFill, COLORS.caution).restore();
  doc.rect(x, y, 4, h).fill(COLORS.caution);
  doc.font('bold').fontSize(11).fillColor(COLORS.caution).text(title.toUpperCase(), x + pad + 4, y + pad, { width: inner + 14 });
  let cy = y + pad + 18;
  doc.font('regular').fontSize(10).fillColor(COLORS.ink);
  for (const c of cautions) {
    doc.text('!', x + pad + 4, cy, { width: 10 });
    doc.text(c, x + pad + 18, cy, { width: inner });
    cy += doc.heightOfString(c, { width: inner }) + 3;
  }
  doc.x = x;
  doc.y = y + h + 8;
  doc.fillColor(COLORS.ink);
}
