import type { AccessFindingView } from '../../src/domain/contracts/tour.ts';
import { formatNumber, fromKg, fromMm } from '../../src/domain/units.ts';
import type { DocumentContext } from '../modules/documents/document-context.ts';
import type { VenueManifestDocument } from '../modules/documents/manifest-document.service.ts';
import { cautionsBlock } from './cautions.ts';
import { COLORS, PdfWriter } from './document.ts';
import { massText, sizeText } from './figures.ts';

/**
 * The manifest a venue receives ahead of the load-in: crates in unloading order with sizes and masses,
 * totals, every access-check result at this venue (passes, failures with reason and margin, what could
 * not be checked), the lift plans that apply with their hook loads, the hanging points, contacts and the
 * cautions. Imperial figures alongside for venues whose paperwork is imperial. Lays out; computes nothing.
 */

const VERDICT_WORD = { pass: 'pass', fail: 'FAIL', unknown: 'not checked' } as const;
const STATUS_WORD = { draft: 'draft — not approved', submitted: 'submitted — not approved', approved: 'approved', rejected: 'rejected — not to be used' } as const;

/** "margin −20 mm (−0.8 in)": the finding's margin as the access core gave it. */
export function marginText(f: Pick<AccessFindingView, 'margin' | 'marginUnit'>, imperial: boolean): string | null {
  if (f.margin === undefined || !Number.isFinite(f.margin)) return null;
  const sign = (v: number, d: number) => `${v < 0 ? '−' : '+'}${formatNumber(Math.abs(v), d)}`;
  const unit = f.marginUnit ?? '';
  let text = `margin ${sign(f.margin, unit === 'mm' || unit === 'kg' ? 0 : 2)}${unit ? ` ${unit}` : ''}`;
  if (imperial && unit === 'mm') text += ` (${sign(fromMm(f.margin, 'in'), 1)} in)`;
  if (imperial && unit === 'kg') text += ` (${sign(fromKg(f.margin, 'lb'), 0)} lb)`;
  return text;
}

export async function renderVenueManifestPdf(d: VenueManifestDocument, ctx: DocumentContext): Promise<Buffer> {
  const m = d.manifest;
  const imp = d.imperial;
  const e = m.engagement;
  const w = new PdfWriter({
    paperSize: ctx.paperSize,
    title: `Manifest — ${m.venue.name}`,
    headerRight: ctx.productionName,
    footerLeft: `Printed ${ctx.printedOn} by ${ctx.printedBy}. Masses are estimates until weighed.`,
  });
  w.title(`Manifest — ${m.venue.name}`, `${m.production.name} · load-in ${e.loadInOn} · shows ${e.showFirstOn} to ${e.showLastOn} · load-out ${e.loadOutOn}`);
  const accessColor = m.access.verdict === 'pass' ? COLORS.ok : COLORS.danger;
  w.paragraph(
    `Access at this venue: ${m.access.pass} pass, ${m.access.fail} fail, ${m.access.unknown} not checked${m.access.verdict === 'unknown' && m.access.fail === 0 ? ' (venue data missing)' : ''}.`,
    { bold: true, size: 12, color: accessColor },
  );

  w.heading('Delivery');
  const t = m.totals;
  w.keyValues(
    [
      ['Venue', [m.venue.name, m.venue.address, m.venue.city, m.venue.country].filter(Boolean).join(', ')],
      ['Arriving from', m.leg ? `${m.leg.fromVenueName ?? 'the workshop'}${m.leg.departsOn ? `, leaving ${m.leg.departsOn}` : ''}` : 'no leg delivers here yet'],
      ['Vehicles', m.leg?.vehicles.map((v) => v.name).join(', ') || 'not decided'],
      ['Crates', String(t.crateCount)],
      ['Gross, all crates', t.grossKg === null ? `at least ${massText(t.knownGrossKg, imp)} (${t.unknownMassCount} crate${t.unknownMassCount === 1 ? '' : 's'} of unknown mass)` : massText(t.grossKg, imp)],
      ['Tare, all crates', massText(t.tareKg, imp)],
      ['Volume', `${formatNumber(t.volumeM3, 1)} m³${imp ? ` (${formatNumber(t.volumeM3 * 35.3146667, 0)} ft³)` : ''}`],
      ['Paperwork units', imp ? 'metric with imperial alongside' : 'metric'],
    ],
    0.24,
  );

  w.heading('Crates in unloading order');
  if (m.crates.length === 0) w.paragraph('No crates are listed for this engagement.', { color: COLORS.danger });
  else {
    w.table(
      [
        { header: '#', width: 0.45, align: 'right' },
        { header: 'Crate', width: 0.9 },
        { header: 'Name', width: 2.2 },
        { header: 'L × W × H', width: imp ? 2.6 : 1.9, align: 'right' },
        { header: 'Gross', width: imp ? 1.9 : 1.1, align: 'right' },
        { header: 'Vehicle', width: 1.3 },
        { header: 'Access', width: 1 },
      ],
      [
        ...m.crates.map((c) => [
          String(c.loadOrder),
          c.code,
          c.name,
          sizeText([c.lengthMm, c.widthMm, c.heightMm], imp),
          c.grossKg === null ? 'UNKNOWN' : massText(c.grossKg, imp, 0),
          c.vehicleName ?? '—',
          VERDICT_WORD[c.access.verdict],
        ]),
        ['', 'Total', `${t.crateCount} crates`, `${formatNumber(t.volumeM3, 1)} m³`, t.grossKg === null ? `≥ ${massText(t.knownGrossKg, imp, 0)}` : massText(t.grossKg, imp, 0), '', ''],
      ],
      { rowColor: (i) => (i < m.crates.length && m.crates[i].access.verdict !== 'pass' ? COLORS.danger : undefined) },
    );
  }

  w.heading('Access checks at this venue');
  const open = m.crates.filter((c) => c.access.verdict !== 'pass');
  if (m.crates.length && open.length === 0) w.paragraph('Every crate passes every check at this venue.', { color: COLORS.ok, bold: true });
  for (const c of open) {
    w.paragraph(`${c.code} ${c.name}: ${VERDICT_WORD[c.access.verdict]}${c.access.tightestText ? ` — tightest: ${c.access.tightestText}` : ''}`, { bold: true, color: c.access.verdict === 'fail' ? COLORS.danger : COLORS.caution });
    w.bullets(
      c.access.findings
        .filter((f) => f.verdict !== 'pass')
        .map((f) => {
          const margin = marginText(f, imp);
          return `${VERDICT_WORD[f.verdict]} · ${f.check}${f.where ? ` (${f.where})` : ''}: ${f.reason}${margin ? ` — ${margin}` : ''}`;
        }),
    );
  }
  const passes = m.crates.flatMap((c) => c.access.findings.filter((f) => f.verdict === 'pass').map((f) => ({ code: c.code, f })));
  if (passes.length) {
    w.paragraph('Passed:', { bold: true, size: 9.5 });
    w.bullets(
      passes.map(({ code, f }) => {
        const margin = marginText(f, imp);
        return `${code} · ${f.check}${f.where ? ` (${f.where})` : ''}: ${f.reason}${margin ? ` — ${margin}` : ''}`;
      }),
    );
  }

  w.heading('Lift plans at this venue');
  if (d.liftPlans.length === 0) w.paragraph('No lift plan is made for this venue.');
  else {
    w.table(
      [
        { header: 'Lift plan', width: 2.3 },
        { header: 'Section', width: 0.95 },
        { header: 'Date', width: 1.4 },
        { header: 'Status', width: 1.7 },
        { header: 'Verdict', width: 1.1 },
        { header: 'Static hook', width: imp ? 1.9 : 1.1, align: 'right' },
        { header: 'Dynamic hook', width: imp ? 1.9 : 1.1, align: 'right' },
      ],
      d.liftPlans.map((p) => [p.title, p.sectionCode ?? '—', p.liftDate ?? '—', STATUS_WORD[p.status], p.verdict === 'ok' ? 'within capacity' : p.verdict.toUpperCase(), massText(p.staticHookLoadKg, imp), massText(p.dynamicHookLoadKg, imp)]),
      { rowColor: (i) => (d.liftPlans[i].status !== 'approved' || d.liftPlans[i].verdict !== 'ok' ? COLORS.danger : undefined) },
    );
    const problems = d.liftPlans.flatMap((p) => p.problems.map((x) => `${p.title}: ${x}`));
    if (problems.length) w.bullets(problems, { color: COLORS.danger });
    w.paragraph('Only an approved plan may be used; the full plan with its drawing and sign-off is printed separately.', { color: COLORS.muted, size: 8.5 });
  }

  if (d.hangingPoints.length) {
    w.heading('Hanging points (as the venue gave them)');
    w.table(
      [
        { header: 'Point', width: 2 },
        { header: 'Rating', width: 1.4, align: 'right' },
        { header: 'Notes', width: 4 },
      ],
      d.hangingPoints.map((p) => [p.label, p.ratingKg === null ? 'not given' : massText(p.ratingKg, imp, 0), p.notes || '—']),
    );
  }

  w.heading('Contacts');
  if (m.venue.contacts.length === 0) w.paragraph('No contacts recorded for this venue.');
  else {
    w.table(
      [
        { header: 'Name', width: 1.6 },
        { header: 'Role', width: 1.4 },
        { header: 'E-mail', width: 2.2 },
        { header: 'Phone', width: 1.3 },
      ],
      m.venue.contacts.map((c) => [c.name, c.role || '—', c.email || '—', c.phone || '—']),
    );
  }
  w.paragraph(`Production: ${ctx.productionName}${ctx.machineName ? ` (${ctx.machineName})` : ''}. Questions about this manifest go to the production's planner.`, { color: COLORS.muted, size: 9 });
  if (m.notes.length) w.bullets(m.notes, { color: COLORS.caution });
  cautionsBlock(w, d.cautions);
  return w.finish();
}
