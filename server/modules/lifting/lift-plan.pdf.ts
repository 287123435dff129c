import type { GearItem, LiftPlanInput } from '../../../src/domain/contracts/lifting.ts';
import { HOIST_RULE_SETS, type LiftPlanResult } from '../../../src/domain/lifting/index.ts';
import { cautionsBlock } from '../../pdf/cautions.ts';
import { COLORS, PdfWriter, type PaperSize } from '../../pdf/document.ts';
import { Viewport } from '../../pdf/drawing.ts';
import type { PlanView } from './lift-plans.service.ts';

/**
 * The printable lift plan: drawing (plan and elevation with pick points, CoG and its uncertainty,
 * slings, hook and leg loads), the figures, problems, method and sources, gear, signatures, history
 * and the cautions. It lays out the saved evaluation; it computes nothing.
 */

const kg = (v: number | null | undefined) => (v === null || v === undefined || !Number.isFinite(v) ? '—' : `${v.toLocaleString('en-GB', { maximumFractionDigits: 1, minimumFractionDigits: 1 })} kg`);
const mm = (v: number) => `${Math.round(v).toLocaleString('en-GB')}`;
const pct = (u: number | null) => (u === null || !Number.isFinite(u) ? 'no rating' : `${Math.round(u * 100)} %`);
const day = (iso: string | null) => (iso ? iso.slice(0, 10) : '—');

const STATUS_WORDS: Record<PlanView['status'], string> = {
  draft: 'DRAFT — not approved',
  submitted: 'SUBMITTED — awaiting review, not approved',
  approved: 'APPROVED',
  rejected: 'REJECTED — not to be used',
};

function gearRating(g: GearItem): string {
  switch (g.kind) {
    case 'hoist':
      return `${kg(g.ratedLoadKg)} rated, class ${g.hoistClass}, self ${kg(g.selfWeightKg)} + chain ${kg(g.chainWeightKg)}`;
    case 'sling':
      return `${kg(g.verticalRatingKg)} vertical, ${g.slingType}, ${mm(g.lengthMm)} mm`;
    case 'shackle':
      return `${kg(g.ratingKg)}`;
    case 'lifting-point':
      return `${kg(g.ratingKg)} axial (${g.pointType})${g.angleDerating?.length ? `; derating ${g.angleDerating.map((r) => `≤${r.upToDegFromAxis}° ×${r.factor}`).join(', ')}` : ''}`;
    case 'spreader-beam':
      return `${kg(g.ratingKg)}${g.lengthMm ? `, ${mm(g.lengthMm)} mm` : ''}`;
  }
}

/** Hook position and leg lines in the load's own frame, for the drawing. */
function rigLines(input: LiftPlanInput, result: LiftPlanResult): { hook: [number, number, number] | null; legs: { from: [number, number, number]; to: [number, number, number] }[]; beam: [[number, number, number], [number, number, number]] | null } {
  const picks = input.pickPoints.map((p) => p.positionMm);
  if (picks.length === 0) return { hook: null, legs: [], beam: null };
  const topZ = Math.max(...picks.map((p) => p[2]));
  if (input.suspension.kind === 'single-hook') {
    const hook = result.hanging?.hookInLoadMm ?? null;
    return { hook, legs: hook ? picks.map((p) => ({ from: p, to: hook })) : [], beam: null };
  }
  const rise = 900;
  const legs = picks.map((p) => ({ from: p, to: [p[0], p[1], topZ + rise] as [number, number, number] }));
  if (input.suspension.kind === 'spreader-beam') {
    const xs = picks.map((p) => p[0]);
    const ys = picks.map((p) => p[1]);
    const a: [number, number, number] = [Math.min(...xs), (Math.min(...ys) + Math.max(...ys)) / 2, topZ + rise];
    const b: [number, number, number] = [Math.max(...xs), (Math.min(...ys) + Math.max(...ys)) / 2, topZ + rise];
    const hook: [number, number, number] = [input.load.cogMm[0], input.load.cogMm[1], topZ + rise + 900];
    return { hook, legs: [...legs, { from: a, to: hook }, { from: b, to: hook }], beam: [a, b] };
  }
  return { hook: null, legs, beam: null };
}

function drawViews(w: PdfWriter, plan: PlanView): void {
  const input = plan.evaluatedInput;
  const result = plan.result;
  const { hook, legs, beam } = rigLines(input, result);
  const bounds = input.load.boundsMm ?? null;
  const cog = input.load.cogMm;
  const unc = input.load.cogUncertainty && 'plusMinusMm' in input.load.cogUncertainty ? input.load.cogUncertainty.plusMinusMm : null;
  const pts: [number, number, number][] = [cog, ...input.pickPoints.map((p) => p.positionMm), ...(hook ? [hook] : []), ...legs.map((l) => l.to)];
  if (bounds) pts.push(bounds.minMm, bounds.maxMm);
  const zone = result.exclusionZone;
  const range = (axis: 0 | 1 | 2, extra: number[] = []) => {
    const vs = [...pts.map((p) => p[axis]), ...extra];
    return [Math.min(...vs), Math.max(...vs)];
  };
  const [minX, maxX] = range(0, zone ? [zone.minXMm, zone.maxXMm] : []);
  const [minY, maxY] = range(1, zone ? [zone.minYMm, zone.maxYMm] : []);
  const [minZ, maxZ] = range(2);

  const h = 250;
  w.ensureSpace(h + 30);
  const y = w.doc.y;
  const half = (w.width - 10) / 2;
  const tensions = new Map(result.legs.map((l) => [l.pickPointId, l]));

  // Plan: x to the right, y up.
  const plan2 = new Viewport(w, { x: w.left, y, width: half, height: h }, { minU: minX, maxU: maxX, minV: minY, maxV: maxY }, 'PLAN (looking down; x to the right, y up)');
  if (zone) plan2.rect([zone.minXMm, zone.minYMm], [zone.maxXMm, zone.maxYMm], { color: COLORS.danger, dash: 4, width: 0.8 });
  if (zone) plan2.label([zone.minXMm, zone.maxYMm], `Exclusion zone (+${mm(zone.marginMm)} mm)`, { color: COLORS.danger, dy: 2 });
  if (bounds) plan2.rect([bounds.minMm[0], bounds.minMm[1]], [bounds.maxMm[0], bounds.maxMm[1]], { fill: '#dfe6ec', color: COLORS.ink, width: 0.8 });
  if (unc) plan2.rect([cog[0] - unc[0], cog[1] - unc[1]], [cog[0] + unc[0], cog[1] + unc[1]], { color: COLORS.accent, dash: 2, width: 0.6 });
  for (const l of legs) plan2.line([l.from[0], l.from[1]], [l.to[0], l.to[1]], { color: COLORS.accent, width: 1.2 });
  if (beam) plan2.line([beam[0][0], beam[0][1]], [beam[1][0], beam[1][1]], { color: COLORS.ink, width: 3 });
  plan2.cog([cog[0], cog[1]]);
  // Labels alternate above and below their points so that close pick points stay readable.
  const off = (i: number) => (i % 2 === 0 ? { dx: 4, dy: -11 } : { dx: 4, dy: 3 });
  input.pickPoints.forEach((p, i) => {
    plan2.dot([p.positionMm[0], p.positionMm[1]], 3, COLORS.danger);
    const t = tensions.get(p.id);
    plan2.label([p.positionMm[0], p.positionMm[1]], `${p.id}${t ? `: ${kg(t.worstTensionKg)}` : ''}`, { bold: true, ...off(i) });
  });
  if (hook) plan2.dot([hook[0], hook[1]], 2.5, COLORS.ink);

  // Elevation: x to the right, z up.
  const elev = new Viewport(w, { x: w.left + half + 10, y, width: half, height: h }, { minU: minX, maxU: maxX, minV: minZ, maxV: maxZ }, 'ELEVATION (looking along +y; x to the right, z up)');
  if (bounds) elev.rect([bounds.minMm[0], bounds.minMm[2]], [bounds.maxMm[0], bounds.maxMm[2]], { fill: '#dfe6ec', color: COLORS.ink, width: 0.8 });
  if (unc) elev.rect([cog[0] - unc[0], cog[2] - unc[2]], [cog[0] + unc[0], cog[2] + unc[2]], { color: COLORS.accent, dash: 2, width: 0.6 });
  for (const l of legs) elev.line([l.from[0], l.from[2]], [l.to[0], l.to[2]], { color: COLORS.accent, width: 1.2 });
  if (beam) elev.line([beam[0][0], beam[0][2]], [beam[1][0], beam[1][2]], { color: COLORS.ink, width: 3 });
  elev.cog([cog[0], cog[2]]);
  elev.label([cog[0], cog[2]], 'CoG', { dx: 7, dy: -3 });
  input.pickPoints.forEach((p, i) => {
    elev.dot([p.positionMm[0], p.positionMm[2]], 3, COLORS.danger);
    const t = tensions.get(p.id);
    elev.label([p.positionMm[0], p.positionMm[2]], `${p.id}${t ? ` ${t.angleFromHorizontalDeg.toFixed(0)}°` : ''}`, { bold: true, ...off(i) });
  });
  if (hook) {
    elev.dot([hook[0], hook[2]], 3, COLORS.ink);
    elev.label([hook[0], hook[2]], `Hook ${kg(result.loads?.dynamicHookLoadKg)} dyn.`, { dx: 6, dy: -4, bold: true });
  }
  w.doc.x = w.left;
  w.doc.y = y + h + 6;
  w.paragraph(
    `Drawn in the load's own frame as it stands (mm). Red dots: pick points with the worst leg tension over the CoG uncertainty; dashed blue box: CoG uncertainty; dashed red: exclusion zone.` +
      (result.tiltDeg !== null && result.tiltDeg > 0.5 ? ` As it hangs the load tilts ${result.tiltDeg.toFixed(1)}°.` : ''),
    { color: COLORS.muted, size: 8.5 },
  );
}

export interface LiftPlanPdfContext {
  paperSize: PaperSize;
  productionName: string;
  printedBy: string;
  printedOn: string;
  venueName: string | null;
}

export async function renderLiftPlanPdf(plan: PlanView, ctx: LiftPlanPdfContext): Promise<Buffer> {
  const w = new PdfWriter({
    paperSize: ctx.paperSize,
    title: `Lift plan — ${plan.title}`,
    headerRight: ctx.productionName,
    footerLeft: `Printed ${ctx.printedOn} by ${ctx.printedBy}. Figures as evaluated by Ballast on the data of that day.`,
  });
  const input = plan.evaluatedInput;
  const r = plan.result;
  const load = plan.load;

  w.title(`Lift plan: ${plan.title}`, `Section ${load ? `${load.code} ${load.name}` : '(removed)'} · lift date ${plan.liftDate}${ctx.venueName ? ` · ${ctx.venueName}` : ''}`);
  const verdictColor = r.verdict === 'ok' && r.problems.length === 0 ? COLORS.ok : COLORS.danger;
  w.paragraph(`Status: ${STATUS_WORDS[plan.status]}`, { bold: true, size: 12, color: plan.status === 'approved' ? COLORS.ok : COLORS.danger });
  w.paragraph(
    `Verdict: ${r.verdict === 'ok' ? 'within capacity' : r.verdict === 'over capacity' ? 'OVER CAPACITY' : 'NO VERDICT'}${r.problems.length ? ` — ${r.problems.length} unresolved problem${r.problems.length === 1 ? '' : 's'}` : ''}`,
    { bold: true, size: 12, color: verdictColor },
  );
  cautionsBlock(w, r.cautions);

  w.heading('Drawing');
  drawViews(w, plan);

  w.heading('Load and hook');
  const l = r.loads;
  w.keyValues([
    ['Load mass', `${kg(input.load.massKg)} (${input.load.massWeighed ? 'weighed' : 'estimate, not weighed'})`],
    ['Contingency', `${((input.contingency ?? 0) * 100).toFixed(1)} %`],
    ['Design load', kg(l?.designLoadKg)],
    ['CoG', `(${input.load.cogMm.map(mm).join(', ')}) mm${input.load.cogUncertainty && 'plusMinusMm' in input.load.cogUncertainty ? ` ± ${input.load.cogUncertainty.plusMinusMm.map(mm).join(' / ')} mm` : ' (no uncertainty given)'}`],
    ['Rigging below the hook', kg(l?.riggingBelowHookKg)],
    ['Static hook load', kg(l?.staticHookLoadKg)],
    ['Dynamic factor', l ? `${l.dynamicFactor.value} — ${l.dynamicFactor.source}` : '—'],
    ['Dynamic hook load', kg(l?.dynamicHookLoadKg)],
    ['Suspension', input.suspension.kind === 'single-hook' ? 'one hook (CoG settles plumb under it)' : input.suspension.kind === 'hoists' ? 'one hoist per pick point (vertical legs)' : 'spreader beam under one hook (vertical legs)'],
    ['Tilt as it hangs', r.tiltDeg === null ? '—' : `${r.tiltDeg.toFixed(1)}°`],
    ['Exclusion zone', r.exclusionZone ? `x ${mm(r.exclusionZone.minXMm)} to ${mm(r.exclusionZone.maxXMm)}, y ${mm(r.exclusionZone.minYMm)} to ${mm(r.exclusionZone.maxYMm)} mm (${r.exclusionZone.basis}, +${mm(r.exclusionZone.marginMm)} mm)` : '—'],
    ['People beneath the load', input.peopleBelow ? 'YES — refused' : 'No one, at any time'],
  ]);

  w.heading('Legs (worst case over the CoG uncertainty governs)');
  w.table(
    [
      { header: 'Pick point', width: 1 },
      { header: 'Position (mm)', width: 2 },
      { header: 'Angle / min', width: 1.3, align: 'right' },
      { header: 'Nominal', width: 1.3, align: 'right' },
      { header: 'Worst', width: 1.3, align: 'right' },
      { header: 'Governing case', width: 1.8 },
      { header: '× DAF', width: 1.3, align: 'right' },
    ],
    r.legs.map((leg) => {
      const p = input.pickPoints.find((x) => x.id === leg.pickPointId);
      return [
        leg.pickPointId,
        p ? p.positionMm.map(mm).join(', ') : '—',
        `${leg.angleFromHorizontalDeg.toFixed(1)}° / ${Number.isFinite(leg.minAngleFromHorizontalDeg) ? leg.minAngleFromHorizontalDeg.toFixed(1) : '—'}°`,
        kg(leg.nominalTensionKg),
        kg(leg.worstTensionKg),
        `${leg.governingCase} (${leg.ratingBasis})`,
        kg(leg.designTensionKg),
      ];
    }),
  );

  w.heading('Utilisation of each component');
  w.table(
    [
      { header: 'Component', width: 2.4 },
      { header: 'Load', width: 1.1, align: 'right' },
      { header: 'Capacity', width: 1.1, align: 'right' },
      { header: 'Use', width: 0.8, align: 'right' },
      { header: 'Basis', width: 3.6 },
    ],
    r.components.map((c) => [c.subject, kg(c.loadKg), kg(c.capacityKg), pct(c.utilisation), c.basis]),
    { rowColor: (i) => ((r.components[i].utilisation ?? 2) > 1 ? COLORS.danger : undefined) },
  );

  w.heading('Problems and notices');
  const problems = r.findings.filter((f) => f.severity !== 'notice');
  const notices = r.findings.filter((f) => f.severity === 'notice');
  if (problems.length === 0) w.paragraph('No unresolved problems.', { color: COLORS.ok, bold: true });
  else w.bullets(problems.map((f) => `${f.severity.toUpperCase()}: ${f.message}`), { color: COLORS.danger });
  if (notices.length) w.bullets(notices.map((f) => `Notice: ${f.message}`));

  w.heading('Method and sources');
  if (plan.inputs.method) w.paragraph(plan.inputs.method);
  w.bullets(r.methods);
  const set = HOIST_RULE_SETS[input.hoistRuleSet ?? ''];
  if (set) w.paragraph(`Hoist classes: ${set.name}. ${set.source}.`, { color: COLORS.muted, size: 9 });

  w.heading('Rigging gear');
  w.table(
    [
      { header: 'Identifier', width: 1.3 },
      { header: 'Kind', width: 1.1 },
      { header: 'Rating', width: 4 },
      { header: 'Next inspection', width: 1.4 },
    ],
    (input.gear ?? []).map((g) => [g.identifier, g.kind, gearRating(g), g.nextInspectionDate]),
  );

  w.heading('Sign-off');
  w.keyValues([
    ['Author', `${plan.authorName ?? '—'}, created ${day(plan.createdAt)}${plan.submittedAt ? `, submitted ${day(plan.submittedAt)}` : ''}`],
    ['Reviewer', plan.reviewerName ? `${plan.reviewerName}, ${plan.status} ${day(plan.reviewedAt)}` : 'not reviewed'],
    ['Review comment', plan.reviewComment || '—'],
  ]);
  w.ensureSpace(70);
  const sy = w.doc.y + 24;
  const colW = (w.width - 20) / 2;
  for (const [i, who] of ['Author', 'Reviewing rigger (competent person)'].entries()) {
    const x = w.left + i * (colW + 20);
    w.doc.moveTo(x, sy).lineTo(x + colW, sy).lineWidth(0.6).strokeColor(COLORS.ink).stroke();
    w.doc.font('regular').fontSize(8.5).fillColor(COLORS.muted).text(`${who}: signature and date`, x, sy + 3, { width: colW });
  }
  w.doc.x = w.left;
  w.doc.y = sy + 22;

  if (plan.events.length) {
    w.heading('History');
    w.table(
      [
        { header: 'When', width: 1.6 },
        { header: 'What', width: 1.5 },
        { header: 'Who', width: 1.5 },
        { header: 'Verdict', width: 1.1 },
        { header: 'Comment', width: 3.5 },
      ],
      plan.events.map((e) => [e.createdAt.slice(0, 16).replace('T', ' '), e.kind, e.actorName ?? 'Ballast', e.verdict ?? '—', e.comment || '—']),
    );
  }
  cautionsBlock(w, r.cautions, 'Cautions (repeated)');
  return w.finish();
}
