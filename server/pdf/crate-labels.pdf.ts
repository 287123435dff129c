import type { CrateDocument } from '../modules/documents/crate-documents.service.ts';
import { COLORS, PdfWriter } from './document.ts';
import { lengthText, massText } from './figures.ts';
import { centreOfGravity, drawHandlingMark, ISO780_SYMBOL_HEIGHTS_MM, marksGrid, mmToPt } from './handling-marks.ts';
import type { CrateDocContext } from './packing-list.pdf.ts';
import { drawQr } from './qr.ts';

/**
 * Crate labels, one or two to a page: the crate code large, production and machine, gross mass, the CoG
 * mark with its position from corner A, the next stop, the handling marks and a QR code holding the
 * crate's address at the production's public address (check-in reads it). Draws what it is given.
 */

export type LabelsPerPage = 1 | 2;

function drawLabel(w: PdfWriter, d: CrateDocument, ctx: CrateDocContext, box: { x: number; y: number; width: number; height: number }): void {
  const doc = w.doc;
  const c = d.crate;
  const f = c.figures;
  const pad = 14;
  const big = box.height > 500;
  doc.save().rect(box.x, box.y, box.width, box.height).lineWidth(2).strokeColor('#000000').stroke().restore();

  // QR code, top right, with its address under it.
  const qrSize = Math.min(box.width * 0.36, box.height * (big ? 0.3 : 0.45));
  const qrX = box.x + box.width - pad - qrSize;
  const qrY = box.y + pad;
  drawQr(doc, d.qrText, qrX, qrY, qrSize);
  doc.font('regular').fontSize(6.5).fillColor(COLORS.muted).text(d.qrText, qrX - 10, qrY + qrSize + 2, { width: qrSize + 10, align: 'center' });
  const qrBottom = doc.y;

  // Code, name, production.
  const textW = qrX - box.x - 2 * pad;
  let y = box.y + pad;
  const codeSize = Math.min(big ? 96 : 64, (textW / Math.max(c.code.length, 2)) * 1.7);
  doc.font('bold').fontSize(codeSize).fillColor('#000000').text(c.code, box.x + pad, y, { width: textW, lineBreak: false });
  y += codeSize * 1.05;
  doc.font('bold').fontSize(big ? 16 : 13).text(c.name || ' ', box.x + pad, y, { width: textW, height: big ? 40 : 32, ellipsis: true });
  y = doc.y + 2;
  doc.font('regular').fontSize(big ? 12 : 10).fillColor(COLORS.ink).text(`${ctx.productionName}${ctx.machineName ? ` · ${ctx.machineName}` : ''}`, box.x + pad, y, { width: textW });
  y = doc.y + (big ? 12 : 6);

  // Gross mass, large.
  doc.font('bold').fontSize(big ? 30 : 22).fillColor('#000000').text(`GROSS ${massText(f.grossKg, false, 0)}`, box.x + pad, y, { width: textW, lineBreak: false });
  y += big ? 34 : 25;
  if (d.imperial) {
    doc.font('bold').fontSize(big ? 16 : 12).text(massText(f.grossKg, true, 0).replace(/^.*\(/, '(').replace(/\)$/, ')'), box.x + pad, y, { width: textW, lineBreak: false });
    y += big ? 20 : 15;
  }
  if (!f.massComplete) {
    doc.font('bold').fontSize(9).fillColor(COLORS.danger).text('Lower bound: a content line has no mass.', box.x + pad, y, { width: textW });
    y = doc.y + 2;
  }

  // CoG mark and where it is.
  y = Math.max(y, qrBottom + 8);
  const r = big ? 16 : 11;
  doc.save();
  centreOfGravity(doc, box.x + pad + r, y + r * 1.5, r);
  doc.restore();
  const cog = f.cogMm;
  doc
    .font('regular')
    .fontSize(big ? 11 : 9)
    .fillColor(COLORS.ink)
    .text(
      cog ? `CoG from corner A (outer bottom corner, left end of the front side): x ${lengthText(cog[0], d.imperial)}, y ${lengthText(cog[1], d.imperial)}, z ${lengthText(cog[2], d.imperial)}` : 'CoG not known: a content line has no mass or no position.',
      box.x + pad + 2 * r + 10,
      y + 2,
      { width: box.width - 3 * pad - 2 * r - 10 },
    );
  y = Math.max(doc.y, y + r * 3) + (big ? 10 : 4);

  // Next stop.
  const s = d.nextStop;
  doc
    .font('bold')
    .fontSize(big ? 14 : 11)
    .fillColor('#000000')
    .text(s ? `Next: ${s.venueName}, ${s.city}${s.country ? ` (${s.country})` : ''} — load-in ${s.loadInOn}` : 'Next: not on a coming leg', box.x + pad, y, { width: box.width - 2 * pad });
  y = doc.y + (big ? 10 : 4);
  const tip = f.tipping?.tips ? 'LASH OR BLOCK in transport.' : !f.tipping ? 'Tipping not checked: lash or block.' : '';
  if (tip) {
    doc.font('bold').fontSize(big ? 12 : 10).fillColor(COLORS.danger).text(tip, box.x + pad, y, { width: box.width - 2 * pad });
    y = doc.y + 4;
  }

  // Handling marks in the space left at the bottom: ISO 780's 100 mm where it fits, proportionally smaller where not.
  if (d.marks.length) {
    const avail = box.width - 2 * pad;
    const caption = 12;
    const room = box.y + box.height - pad - y - 4;
    const grid = marksGrid(d.marks.length, avail, room, mmToPt(ISO780_SYMBOL_HEIGHTS_MM[0]), caption);
    const size = Math.max(18, grid.sizePt);
    const rows = Math.ceil(d.marks.length / grid.perRow);
    let my = box.y + box.height - pad - rows * (size + caption) - (rows - 1) * grid.gapPt;
    d.marks.forEach((m, i) => {
      const col = i % grid.perRow;
      if (i > 0 && col === 0) my += size + caption + grid.gapPt;
      const x = box.x + pad + col * (size + grid.gapPt);
      drawHandlingMark(doc, m, x, my, size);
      doc.font('bold').fontSize(big ? 8 : 6.5).fillColor('#000000').text(m.caption, x - 3, my + size + 2, { width: size + 6, align: 'center', lineBreak: false });
    });
  }
  doc.fillColor(COLORS.ink).font('regular').fontSize(10);
}

export async function renderCrateLabelsPdf(docs: readonly CrateDocument[], ctx: CrateDocContext, opts: { perPage?: LabelsPerPage } = {}): Promise<Buffer> {
  const perPage = opts.perPage ?? 1;
  const w = new PdfWriter({
    paperSize: ctx.paperSize,
    title: docs.length === 1 ? `Crate label — ${docs[0].crate.code}` : 'Crate labels',
    headerRight: ctx.productionName,
    footerLeft: `Printed ${ctx.printedOn} by ${ctx.printedBy}.`,
  });
  if (docs.length === 0) {
    w.title('Crate labels', 'No crates to label.');
    return w.finish();
  }
  const top = w.doc.page.margins.top;
  const height = w.bottom - top;
  const gap = 16;
  const cellH = (height - (perPage - 1) * gap) / perPage;
  for (let i = 0; i < docs.length; i++) {
    const slot = i % perPage;
    if (i > 0 && slot === 0) w.doc.addPage();
    drawLabel(w, docs[i], ctx, { x: w.left, y: top + slot * (cellH + gap), width: w.width, height: cellH });
  }
  // Leave the cursor inside the page so finish() adds no page.
  w.doc.x = w.left;
  w.doc.y = top;
  return w.finish();
}
