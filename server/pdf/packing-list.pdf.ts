import type { CrateDocument } from '../modules/documents/crate-documents.service.ts';
import { COG_CORNER_TEXT } from '../modules/documents/crate-documents.service.ts';
import { cautionsBlock } from './cautions.ts';
import { crateViews } from './crate-views.ts';
import { COLORS, PdfWriter, type PaperSize } from './document.ts';
import { lengthText, massText, sizeText } from './figures.ts';
import { handlingMarksRow, ISO780_SYMBOL_HEIGHTS_MM, mmToPt } from './handling-marks.ts';

/**
 * The packing list of one crate (or several, one after another): contents with quantities and masses,
 * net, tare and gross, outer size, CoG from corner A, stack limit, the handling marks that apply, the
 * manual-handling verdict with its cautions, tipping under road accelerations ("lash or block") and the
 * ISPM 15 note. Lays out what the crate and lifting cores computed; works out nothing itself.
 */

export interface CrateDocContext {
  paperSize: PaperSize;
  productionName: string;
  machineName: string;
  printedBy: string;
  printedOn: string;
}

const HANDLING_WORDS: Record<CrateDocument['crate']['figures']['handling']['verdict'], string> = {
  'one person': 'ONE PERSON may handle it',
  'team of N': 'TEAM LIFT',
  'mechanical aid required': 'MECHANICAL AID REQUIRED: hoist, forklift or pallet truck',
  'no verdict': 'NO VERDICT',
};

export function handlingHeadline(h: CrateDocument['crate']['figures']['handling']): string {
  if (h.verdict === 'team of N') return `TEAM OF ${h.teamSize ?? '?'} may handle it`;
  return HANDLING_WORDS[h.verdict];
}

function cogText(d: CrateDocument): string {
  const c = d.crate.figures.cogMm;
  if (!c) return 'not known';
  const line = `x ${lengthText(c[0], d.imperial)}, y ${lengthText(c[1], d.imperial)}, z ${lengthText(c[2], d.imperial)}`;
  return `${line} ${COG_CORNER_TEXT}`;
}

function stackText(d: CrateDocument): string {
  const c = d.crate;
  if (!c.stackable || c.maxLoadOnTopKg === 0) return 'Do not stack: nothing may stand on this crate.';
  if (c.maxLoadOnTopKg !== null) return `At most ${massText(Math.floor(c.maxLoadOnTopKg), d.imperial, 0)} on the lid.`;
  return 'May be stacked on (no limit given).';
}

function onePackingList(w: PdfWriter, d: CrateDocument, ctx: CrateDocContext): void {
  const c = d.crate;
  const f = c.figures;
  const imp = d.imperial;
  w.title(`Packing list — crate ${c.code}`, `${c.name || '(no name)'} · ${ctx.productionName}${ctx.machineName ? ` · ${ctx.machineName}` : ''}`);

  const h = f.handling;
  w.paragraph(`Handling: ${handlingHeadline(h)}`, { bold: true, size: 12, color: h.verdict === 'one person' ? COLORS.ok : COLORS.danger });
  if (f.tipping) {
    w.paragraph(f.tipping.tips ? `Transport: LASH OR BLOCK — ${f.tipping.note}` : `Transport: free-standing — ${f.tipping.note}`, {
      bold: true,
      size: 11,
      color: f.tipping.tips ? COLORS.danger : COLORS.ok,
    });
  } else {
    w.paragraph(`Transport: ${f.tippingUnknownReason ?? 'tipping not checked'} Lash or block until it is known.`, { bold: true, size: 11, color: COLORS.danger });
  }

  w.heading('Crate');
  const rows: [string, string][] = [
    ['Crate', `${c.code}${c.name ? ` — ${c.name}` : ''} (${c.kind === 'designed' ? 'crate designed around its section' : c.kind === 'pallet' ? 'pallet' : 'stock case'})`],
    ['Next stop', d.nextStop ? `${d.nextStop.venueName}, ${d.nextStop.city}${d.nextStop.country ? ` (${d.nextStop.country})` : ''}, load-in ${d.nextStop.loadInOn}` : 'not on a coming leg'],
    ['Outer size (L × W × H)', sizeText(c.outerMm, imp)],
  ];
  if (c.innerMm) rows.push(['Inner size', sizeText(c.innerMm, imp)]);
  rows.push(
    ['Net (contents)', `${massText(f.netKg, imp)}${f.massComplete ? '' : ' — lower bound: a content line has no mass'}`],
    ['Tare (empty crate)', massText(f.tareKg, imp)],
    ['Gross', `${massText(f.grossKg, imp)}${f.massComplete ? '' : ' — lower bound'}`],
  );
  if (c.maxGrossKg !== null) rows.push(['Maximum gross', massText(c.maxGrossKg, imp)]);
  rows.push(['Centre of gravity', cogText(d)], ['Stack limit', stackText(d)], ['ISPM 15', c.ispm15Required ? ispmText(d) : 'Not needed: no solid wood over 6 mm (plywood and processed wood are exempt).']);
  w.keyValues(rows, 0.26);

  w.heading('Contents');
  w.table(
    [
      { header: '#', width: 0.4, align: 'right' },
      { header: 'Description', width: 4.2 },
      { header: 'Qty', width: 0.7, align: 'right' },
      { header: imp ? 'Mass kg (lb)' : 'Mass (kg)', width: 1.6, align: 'right' },
      { header: 'CoG from A (mm)', width: 1.9, align: 'right' },
    ],
    [
      ...c.contents.map((x, i) => [
        String(i + 1),
        x.description || '(no description)',
        String(x.quantity),
        x.massKg === null ? 'UNKNOWN' : massText(x.massKg, imp).replace(' kg', ''),
        x.cogMm ? x.cogMm.map((v) => Math.round(v)).join(', ') : 'not given',
      ]),
      ['', 'Net', '', `${massText(f.netKg, imp).replace(' kg', '')}${f.massComplete ? '' : ' +'}`, ''],
    ],
    { rowColor: (i) => (i < c.contents.length && c.contents[i].massKg === null ? COLORS.danger : undefined) },
  );
  if (c.contents.length === 0) w.paragraph('The crate has no contents recorded.', { color: COLORS.danger, bold: true });

  w.heading('Views');
  crateViews(w, c);

  // Keep the heading with its symbols.
  w.ensureSpace(mmToPt(30) + 90);
  w.heading('Handling marks (ISO 780)');
  handlingMarksRow(w, d.marks, { preferredMm: 30 });
  if (d.marks.length === 0) w.paragraph('No handling marks apply.');
  w.bullets(d.marks.map((m) => `${m.caption}: ${m.reason}`));
  w.paragraph(
    `On the crate: black symbols ${ISO780_SYMBOL_HEIGHTS_MM[0]} mm high (ISO 780:2015 normal sizes ${ISO780_SYMBOL_HEIGHTS_MM.join(', ')} mm), on the sides they concern; the centre-of-gravity mark on at least two adjoining sides, over the CoG.`,
    { color: COLORS.muted, size: 8.5 },
  );

  w.heading('Handling and transport');
  w.keyValues([
    ['Verdict', `${handlingHeadline(h)}${h.capacityKg !== null ? ` (guideline capacity ${massText(h.capacityKg, imp)})` : ''}`],
    ['Method', h.method],
  ]);
  w.bullets(h.reasons);
  const notes = [...f.packingListNotes, ...f.warnings];
  if (notes.length) w.bullets(notes);
  if (c.notes) w.paragraph(`Notes: ${c.notes}`);
  cautionsBlock(w, h.cautions);

  w.ensureSpace(60);
  const sy = w.doc.y + 26;
  const colW = (w.width - 20) / 2;
  for (const [i, who] of ['Packed by', 'Checked by'].entries()) {
    const x = w.left + i * (colW + 20);
    w.doc.moveTo(x, sy).lineTo(x + colW, sy).lineWidth(0.6).strokeColor(COLORS.ink).stroke();
    w.doc.font('regular').fontSize(8.5).fillColor(COLORS.muted).text(`${who}: name, signature and date`, x, sy + 3, { width: colW });
  }
  w.doc.x = w.left;
  w.doc.y = sy + 20;
}

function ispmText(d: CrateDocument): string {
  const base = 'Solid wood: heat-treated (HT) timber with the ISPM 15 mark is needed whenever the crate crosses a border.';
  const s = d.nextStop;
  if (s?.crossesBorder) return `${base} The next leg (${s.fromCountry} → ${s.country}) does.`;
  return base;
}

/** One packing list per crate, each starting on a new page. */
export async function renderPackingListPdf(docs: readonly CrateDocument[], ctx: CrateDocContext): Promise<Buffer> {
  const w = new PdfWriter({
    paperSize: ctx.paperSize,
    title: docs.length === 1 ? `Packing list — crate ${docs[0].crate.code}` : 'Packing lists',
    headerRight: ctx.productionName,
    footerLeft: `Printed ${ctx.printedOn} by ${ctx.printedBy}. Masses and CoG are estimates until weighed.`,
  });
  docs.forEach((d, i) => {
    if (i > 0) w.doc.addPage();
    onePackingList(w, d, ctx);
  });
  return w.finish();
}
