import type { Knex } from 'knex';
import type { RunItemView, PlacementView } from '../../../src/domain/contracts/crate-loads.ts';
import { evaluatePlanFields, liftPlanFields, type LiftLoadView, type LiftPlanFields } from '../../../src/domain/contracts/lifting-api.ts';
import type { MassPropertiesInput } from '../../../src/domain/contracts/mass.ts';
import type { ImpactDraftParsed, ImpactRow, ImpactVerdict, ImpactView } from '../../../src/domain/contracts/split.ts';
import type { VenueAccessData } from '../../../src/domain/contracts/tour.ts';
import { decide, type Actor } from '../../../src/domain/policy/index.ts';
import { AppError, forbidden, invalid, type FieldIssue } from '../../http/errors.ts';
import { gearItems, ensureSettings, type PlanRow } from '../lifting/lifting.repository.ts';
import { fingerprintOf, planEvaluator, refreshPlan, updatePlan } from '../lifting/lift-plans.service.ts';
import { ensureMachine, type SectionRow } from '../machine/machine.repository.ts';
import { computeMachineMass, latestWeighings, loadMassInput, type MachineMass } from '../machine/mass.service.ts';
import { runFigures, type RunSettings, type RunVehicle } from '../loads/run-figures.ts';
import { matrixInputs, runMatrix, type MatrixInputs } from '../tour/access.service.ts';
import { splitLimits } from '../split/split-limits.ts';
import { formatLength, formatMass, type UnitSystem } from '../../../src/domain/units.ts';
import { sectionLoad } from '../lifting/lift-loads.ts';

/**
 * The impact view: a draft (typed overrides) is applied to the inputs IN MEMORY, every affected check is
 * run by its own core before and after, and the verdicts are compared. Nothing is saved until the draft
 * is applied, which happens in one transaction.
 */

type Vec3 = [number, number, number];
type MassInput = MassPropertiesInput & { sectionMargins: Record<string, number | null> };

/** The figures of the impact rows in the person's units (masses to 0.1 kg or lb, CoG to the mm or 0.1 in). */
function figureText(units: UnitSystem) {
  return {
    kg: (v: number | null | undefined) => (v === null || v === undefined || !Number.isFinite(v) ? 'unknown' : formatMass(v, units)),
    cogText: (c: Vec3 | null | undefined) => (c ? `CoG ${c.map((v) => formatLength(v, units)).join(', ')}` : 'CoG unknown'),
  };
}

function change(before: ImpactVerdict, after: ImpactVerdict): ImpactRow['change'] {
  if (before === after) return 'changed';
  if (before === 'pass' && after === 'fail') return 'pass→fail';
  if (before === 'fail' && after === 'pass') return 'fail→pass';
  return after === 'unknown' ? 'to unknown' : 'from unknown';
}

/** The mass input with the draft's part masses and new assemblies, checked against the production's rows. */
export function applyMassDraft(input: MassInput, draft: ImpactDraftParsed): MassInput {
  const issues: FieldIssue[] = [];
  const lines = input.lines.map((l) => ({ ...l }));
  const byId = new Map(lines.map((l) => [l.id, l]));
  draft.partMasses.forEach((p, i) => {
    const l = byId.get(p.lineId);
    if (!l) return issues.push({ path: `draft.partMasses.${i}.lineId`, message: 'No part line with that id in this production.' });
    l.unitMassKg = p.unitMassKg;
    if (p.massSource) l.massSource = p.massSource;
  });
  const assemblies = [...input.assemblies];
  const asmIds = new Set(assemblies.map((a) => a.id));
  const secIds = new Set((input.sections ?? []).map((s) => s.id));
  draft.newAssemblies.forEach((a, i) => {
    if (a.parentId && !asmIds.has(a.parentId)) issues.push({ path: `draft.newAssemblies.${i}.parentId`, message: 'No assembly with that id in this production.' });
    if (a.sectionId && !secIds.has(a.sectionId)) issues.push({ path: `draft.newAssemblies.${i}.sectionId`, message: 'No section with that id in this production.' });
    if (a.bboxMm && a.bboxMm.minMm.some((v, k) => v > a.bboxMm!.maxMm[k])) issues.push({ path: `draft.newAssemblies.${i}.bboxMm`, message: 'The box minimum exceeds its maximum.' });
    const id = `draft-assembly-${i + 1}`;
    assemblies.push({ id, label: a.number, parentId: a.parentId, sectionId: a.sectionId });
    lines.push({ id: `draft-line-${i + 1}`, label: `${a.number} (draft)`, assemblyId: id, sectionId: null, quantity: 1, unitMassKg: a.massKg, massSource: 'estimated', cogMm: a.cogMm, bboxMm: a.bboxMm });
  });
  if (issues.length) throw invalid('Some fields of the draft are not valid.', issues);
  return { ...input, lines, assemblies };
}

/** Sections as lift loads, read the way the lifting module reads them (lift-loads.ts): weighing first. */
export function loadsFromMass(mass: MachineMass, sections: SectionRow[]): Map<string, LiftLoadView> {
  return new Map(sections.map((s) => [s.id, sectionLoad(s, mass)]));
}

/** What a section weighs for crating and transport: the weighing, else the computed mass with margin (crates.service's rule). */
function governingKg(mass: MachineMass, sectionId: string): number | null {
  const m = mass.sections[sectionId];
  if (!m) return null;
  return m.weighing?.massKg ?? m.massWithMarginKg;
}

const planVerdict = (v: string): ImpactVerdict => (v === 'ok' ? 'pass' : v === 'over capacity' ? 'fail' : 'unknown');

function withHoist(fields: LiftPlanFields, hoistGearId: string): LiftPlanFields {
  const s = fields.suspension;
  const suspension = s.kind === 'hoists' ? { ...s, legs: s.legs.map((l) => ({ ...l, hoistGearId })) } : { ...s, hoistGearId };
  return { ...fields, suspension } as LiftPlanFields;
}

function withDoors(inputs: MatrixInputs, venues: Map<string, VenueAccessData>): MatrixInputs {
  return {
    rows: inputs.rows,
    columns: inputs.columns.map((c) => {
      const a = venues.get(c.venueId);
      if (!a) return c;
      return { ...c, venue: { ...c.venue, access: { ...c.venue.access, doors: a.doors } } };
    }),
  };
}

interface Loaded {
  massBefore: MachineMass;
  massAfter: MachineMass;
  sections: SectionRow[];
  crateDelta: Map<string, number>;
}

/**
 * Evaluates a draft: sections (mass, CoG, within the largest hoist), crates (gross against their maximum),
 * lift plans (verdict, and approvals the draft would withdraw), truck loads (payload and axle checks) and
 * venue access (every crate and section at every engagement). Returns every row whose verdict or figures
 * move.
 */
export async function evaluateDraft(db: Knex, productionId: string, draft: ImpactDraftParsed, units: UnitSystem = 'metric'): Promise<ImpactView & { loaded: Loaded }> {
  const { kg, cogText } = figureText(units);
  const rows: ImpactRow[] = [];
  const warnings: string[] = [];
  const [input, weighings, sections, limits] = await Promise.all([
    loadMassInput(db, productionId),
    latestWeighings(db, productionId),
    db<SectionRow>('machine_sections').where({ production_id: productionId }).orderBy(['sort_order', 'code']),
    splitLimits(db, productionId, {}),
  ]);
  const after = applyMassDraft(input, draft);
  const massBefore = computeMachineMass(input, weighings);
  const massAfter = computeMachineMass(after, weighings);

  // ---- sections: mass and CoG; within the largest hoist's capacity (the split advisor's limit, before contingency).
  const hoist = limits.mass.hoist;
  const capacityKg = hoist ? (hoist.effectiveRatingKg - hoist.riggingKg) / hoist.dynamicFactor : null;
  if (!hoist) warnings.push(`Sections: no hoist verdict: ${limits.mass.problems.join(' ')}`);
  for (const s of sections) {
    const b = massBefore.sections[s.id];
    const a = massAfter.sections[s.id];
    if (!b || !a) continue;
    const moved = Math.abs(a.massKg - b.massKg) > 1e-6 || (a.cogMm && b.cogMm && a.cogMm.some((v, i) => Math.abs(v - b.cogMm![i]) > 0.5));
    if (!moved) continue;
    const gb = governingKg(massBefore, s.id);
    const ga = governingKg(massAfter, s.id);
    const v = (g: number | null, complete: boolean): ImpactVerdict => (capacityKg === null || g === null || !complete ? 'unknown' : g <= capacityKg ? 'pass' : 'fail');
    const vb = v(gb, b.complete || Boolean(b.weighing));
    const va = v(ga, a.complete || Boolean(a.weighing));
    rows.push({
      kind: 'section',
      id: s.id,
      label: `Section ${s.code}`,
      check: capacityKg === null ? 'mass and CoG' : `within hoist ${hoist!.identifier} after rigging and dynamic factor (${kg(capacityKg)})`,
      before: { verdict: vb, figure: `${kg(b.massKg)} (${kg(gb)} with margin or weighed), ${cogText(b.cogMm as Vec3 | null)}` },
      after: { verdict: va, figure: `${kg(a.massKg)} (${kg(ga)} with margin or weighed), ${cogText(a.cogMm as Vec3 | null)}` },
      change: change(vb, va),
      ...(b.weighing ? { note: `weighed ${b.weighing.weighedOn}: the weighing governs until the section is weighed again` } : {}),
    });
  }

  // ---- crates: the content lines that carry a section or a part line move with it.
  const lineBefore = new Map(input.lines.map((l) => [l.id, l.unitMassKg]));
  const lineAfter = new Map(after.lines.map((l) => [l.id, l.unitMassKg]));
  const contents = await db('crate_contents').where({ production_id: productionId }).select('id', 'crate_id', 'section_id', 'part_line_id', 'quantity', 'mass_kg');
  const crateDelta = new Map<string, number>();
  for (const c of contents) {
    let d = 0;
    if (c.section_id) {
      const gb = governingKg(massBefore, c.section_id);
      const ga = governingKg(massAfter, c.section_id);
      if (gb !== null && ga !== null) d = ga - gb;
    } else if (c.part_line_id) {
      const ub = lineBefore.get(c.part_line_id);
      const ua = lineAfter.get(c.part_line_id);
      if (ub != null && ua != null) d = Number(c.quantity) * (ua - ub);
    }
    if (Math.abs(d) > 1e-9) crateDelta.set(c.crate_id, (crateDelta.get(c.crate_id) ?? 0) + d);
  }
  const crateRows = crateDelta.size ? await db('crates').whereIn('id', [...crateDelta.keys()]).select('id', 'code', 'tare_kg', 'max_gross_kg') : [];
  const grossOf = new Map<string, number | null>();
  if (crateRows.length) {
    const sums = await db('crate_contents').whereIn('crate_id', crateRows.map((c) => c.id)).groupBy('crate_id').select('crate_id', db.raw('bool_or(mass_kg is null) as unknown'), db.raw('coalesce(sum(mass_kg), 0) as net'));
    for (const c of crateRows) {
      const s = sums.find((x) => x.crate_id === c.id);
      grossOf.set(c.id, s?.unknown ? null : Number(c.tare_kg) + Number(s?.net ?? 0));
    }
  }
  for (const c of crateRows) {
    const gb = grossOf.get(c.id) ?? null;
    const ga = gb === null ? null : gb + (crateDelta.get(c.id) ?? 0);
    const max = c.max_gross_kg === null ? null : Number(c.max_gross_kg);
    const v = (g: number | null): ImpactVerdict => (g === null || max === null ? 'unknown' : g <= max ? 'pass' : 'fail');
    rows.push({
      kind: 'crate',
      id: c.id,
      label: `Crate ${c.code}`,
      check: max === null ? 'gross mass (no maximum gross recorded)' : `gross within the crate's maximum ${kg(max)}`,
      before: { verdict: v(gb), figure: `gross ${kg(gb)}` },
      after: { verdict: v(ga), figure: `gross ${kg(ga)}` },
      change: change(v(gb), v(ga)),
    });
  }

  // ---- lift plans: before and after by the lifting core, with the plan's own evaluation rules.
  const approvalsWithdrawn: ImpactView['approvalsWithdrawn'] = [];
  const plans = await db<PlanRow>('lift_plans').where({ production_id: productionId }).orderBy('title');
  const planIds = new Set(plans.map((p) => p.id));
  const hoistFor = new Map(draft.planHoists.map((h) => [h.planId, h.hoistGearId]));
  const [gear, settingsRow] = await Promise.all([gearItems(db, productionId), ensureSettings(db, productionId)]);
  const issues: FieldIssue[] = [];
  draft.planHoists.forEach((h, i) => {
    if (!planIds.has(h.planId)) issues.push({ path: `draft.planHoists.${i}.planId`, message: 'No lift plan with that id in this production.' });
    if (!gear.some((g) => g.id === h.hoistGearId && g.kind === 'hoist')) issues.push({ path: `draft.planHoists.${i}.hoistGearId`, message: 'No hoist with that id in the gear inventory.' });
  });
  if (issues.length) throw invalid('Some fields of the draft are not valid.', issues);
  const loadsBefore = loadsFromMass(massBefore, sections);
  const loadsAfter = loadsFromMass(massAfter, sections);
  const settings = { dynamicFactor: settingsRow.dynamic_factor, dynamicFactorSource: settingsRow.dynamic_factor_source, hoistRuleSet: settingsRow.hoist_rule_set, exclusionMarginMm: settingsRow.exclusion_margin_mm };
  for (const p of plans) {
    const parsed = liftPlanFields.safeParse(p.inputs);
    if (!parsed.success) continue;
    const fields = parsed.data;
    const points = fields.venueId ? await db('hanging_points').where({ production_id: productionId, venue_id: fields.venueId }).select('label', 'rating_kg') : [];
    const venuePoints = points.map((r) => ({ label: r.label as string, ratingKg: r.rating_kg as number | null }));
    const b = evaluatePlanFields(fields, { load: loadsBefore.get(fields.sectionId) ?? null, gear, settings, venuePoints });
    const newHoist = hoistFor.get(p.id);
    const a = evaluatePlanFields(newHoist ? withHoist(fields, newHoist) : fields, { load: loadsAfter.get(fields.sectionId) ?? null, gear, settings, venuePoints });
    const fb = fingerprintOf(b.input);
    const fa = fingerprintOf(a.input);
    if (fa === fb) continue;
    const withdrawn = p.status === 'approved';
    const why = newHoist ? 'the hoist changes' : "the section's mass or CoG changes";
    if (withdrawn) approvalsWithdrawn.push({ planId: p.id, title: p.title, why: `Approval would be withdrawn: ${why}; the plan goes back to draft for review.` });
    const dyn = (r: typeof b) => r.result.loads?.dynamicHookLoadKg;
    rows.push({
      kind: 'lift-plan',
      id: p.id,
      label: `Lift plan "${p.title}" (${p.status})`,
      check: 'lift plan verdict (every component against its load)',
      before: { verdict: planVerdict(b.result.verdict), figure: `${b.result.verdict}; dynamic hook load ${kg(dyn(b))}` },
      after: { verdict: planVerdict(a.result.verdict), figure: `${a.result.verdict}; dynamic hook load ${kg(dyn(a))}` },
      change: change(planVerdict(b.result.verdict), planVerdict(a.result.verdict)),
      note: withdrawn ? 'approval would be withdrawn' : `${p.status}: would need review again`,
    });
  }

  // ---- truck loads: the packing runs holding a crate whose gross moves.
  if (crateDelta.size) {
    const runs = await db('packing_runs').where({ production_id: productionId, status: 'done' }).select('id', 'name', 'input', 'result');
    for (const r of runs) {
      const inp = r.input as { vehicles: RunVehicle[]; items: RunItemView[]; options: { fullSupport: boolean }; settings: RunSettings };
      const res = r.result as { placements: PlacementView[]; unplaced: { id: string; quantity: number }[] } | null;
      if (!res || !inp?.items?.some((i) => crateDelta.has(i.id))) continue;
      const itemsAfter = inp.items.map((i) => (crateDelta.has(i.id) ? { ...i, massKg: i.massKg + (crateDelta.get(i.id) ?? 0) } : i));
      const fb = runFigures(inp.vehicles, inp.items, res.placements, res.unplaced, inp.settings, inp.options.fullSupport);
      const fa = runFigures(inp.vehicles, itemsAfter, res.placements, res.unplaced, inp.settings, inp.options.fullSupport);
      fb.vehicles.forEach((vb, k) => {
        const va = fa.vehicles[k];
        if (!va || Math.abs(va.loadKg - vb.loadKg) < 1e-6) return;
        const veh = inp.vehicles.find((v) => v.id === vb.vehicleId);
        const verdictOf = (v: typeof vb): ImpactVerdict => (v.loadPlan.ok ? 'pass' : 'fail');
        const axles = (v: typeof vb) => {
          const lp = v.loadPlan as unknown as { problems?: string[] };
          return lp.problems?.length ? `; ${lp.problems.join(' ')}` : '';
        };
        rows.push({
          kind: 'truck-load',
          id: `${r.id}:${vb.vehicleId}`,
          label: `Packing run "${r.name}", ${veh?.name ?? 'vehicle'}`,
          check: 'payload, CoG and axle loads (load plan check)',
          before: { verdict: verdictOf(vb), figure: `${kg(vb.loadKg)} of ${kg(vb.maxPayloadKg)}${axles(vb)}` },
          after: { verdict: verdictOf(va), figure: `${kg(va.loadKg)} of ${kg(va.maxPayloadKg)}${axles(va)}` },
          change: change(verdictOf(vb), verdictOf(va)),
        });
      });
    }
  }

  // ---- venue access: crates (gross) and sections (mass, size) at every engagement, doors as drafted.
  const base = await matrixInputs(db, productionId);
  const doorDraft = new Map<string, VenueAccessData>();
  if (draft.venueDoors.length) {
    const venues = await db('venues').where({ production_id: productionId }).whereIn('id', [...new Set(draft.venueDoors.map((d) => d.venueId))]).select('id', 'access');
    const vIssues: FieldIssue[] = [];
    draft.venueDoors.forEach((d, i) => {
      const v = venues.find((x) => x.id === d.venueId);
      if (!v) return vIssues.push({ path: `draft.venueDoors.${i}.venueId`, message: 'No venue with that id in this production.' });
      const access: VenueAccessData = doorDraft.get(v.id) ?? { ...(v.access as VenueAccessData), doors: [...((v.access as VenueAccessData | null)?.doors ?? [])] };
      const door = access.doors[d.doorIndex];
      if (!door) return vIssues.push({ path: `draft.venueDoors.${i}.doorIndex`, message: `The venue has ${access.doors.length} door(s) on its route; no door ${d.doorIndex + 1}.` });
      access.doors[d.doorIndex] = { ...door, ...(d.widthMm !== undefined ? { widthMm: d.widthMm } : {}), ...(d.heightMm !== undefined ? { heightMm: d.heightMm } : {}) };
      doorDraft.set(v.id, access);
    });
    if (vIssues.length) throw invalid('Some fields of the draft are not valid.', vIssues);
  }
  const afterRows = base.rows.map((r) => {
    if (r.kind === 'crate') return crateDelta.has(r.id) && r.grossKg !== null ? { ...r, grossKg: r.grossKg + (crateDelta.get(r.id) ?? 0) } : r;
    const b = massBefore.sections[r.id];
    const a = massAfter.sections[r.id];
    if (!a || !b || (Math.abs(a.massKg - b.massKg) < 1e-9 && JSON.stringify(a.bboxMm) === JSON.stringify(b.bboxMm))) return r;
    const size = a.bboxMm ? [0, 1, 2].map((i) => a.bboxMm!.maxMm[i] - a.bboxMm!.minMm[i]) : null;
    const grossKg = a.weighing?.massKg ?? (a.complete && a.massWithMarginKg > 0 ? a.massWithMarginKg : null);
    return { ...r, grossKg, lengthMm: size && size[0] > 0 ? size[0] : null, widthMm: size && size[1] > 0 ? size[1] : null, heightMm: size && size[2] > 0 ? size[2] : null };
  });
  const mb = runMatrix(base);
  const ma = runMatrix(withDoors({ rows: afterRows, columns: base.columns }, doorDraft));
  const rowById = new Map(base.rows.map((r) => [r.id, r]));
  const colById = new Map(base.columns.map((c) => [c.engagementId, c]));
  for (const cb of mb.cells) {
    const ca = ma.cells.find((c) => c.rowId === cb.rowId && c.engagementId === cb.engagementId);
    if (!ca || (ca.verdict === cb.verdict && ca.tightestText === cb.tightestText)) continue;
    const row = rowById.get(cb.rowId);
    const col = colById.get(cb.engagementId);
    rows.push({
      kind: 'access',
      id: `${cb.rowId}:${cb.engagementId}`,
      label: `${row?.kind === 'crate' ? 'Crate' : 'Section'} ${row?.code ?? ''} at ${col?.venueName ?? 'venue'} (${col?.loadInOn ?? ''})`,
      check: 'venue access (doors, lift, floor, dock, ramps)',
      before: { verdict: cb.verdict, figure: cb.tightestText ?? cb.verdict },
      after: { verdict: ca.verdict, figure: ca.tightestText ?? ca.verdict },
      change: change(cb.verdict, ca.verdict),
    });
  }

  const order = { 'pass→fail': 0, 'fail→pass': 1, 'to unknown': 2, 'from unknown': 3, changed: 4 } as const;
  rows.sort((a, b) => order[a.change] - order[b.change]);
  return {
    rows,
    counts: { passToFail: rows.filter((r) => r.change === 'pass→fail').length, failToPass: rows.filter((r) => r.change === 'fail→pass').length, changed: rows.filter((r) => r.change === 'changed').length },
    approvalsWithdrawn,
    warnings,
    loaded: { massBefore, massAfter, sections, crateDelta },
  };
}

/**
 * Applies a draft in one transaction: part masses, new assemblies, lift plans' hoists (through the lifting
 * module's update, which withdraws an approval), venue doors, the crate content lines that carry a changed
 * section or part; then every lift plan is brought up to date, so approvals the change undoes are
 * withdrawn at once (with their history). A stale part line (its version given) answers 409.
 */
export async function applyDraft(db: Knex, actor: Actor, productionId: string, draft: ImpactDraftParsed, units: UnitSystem = 'metric'): Promise<ImpactView> {
  for (const [action, used] of [
    ['machine.edit', draft.partMasses.length + draft.newAssemblies.length > 0],
    ['liftplan.edit', draft.planHoists.length > 0],
    ['venue.edit', draft.venueDoors.length > 0],
  ] as const) {
    if (!used) continue;
    const subjects = action === 'venue.edit' ? draft.venueDoors.map((d) => d.venueId) : [null];
    for (const venueId of subjects) {
      const d = decide(actor, action, { productionId, venueId });
      if (!d.allowed) throw forbidden(d.reason);
    }
  }
  const { loaded, ...impact } = await evaluateDraft(db, productionId, draft, units);
  await db.transaction(async (trx) => {
    for (const p of draft.partMasses) {
      const q = trx('machine_part_lines').where({ id: p.lineId, production_id: productionId });
      if (p.version !== undefined) q.andWhere({ version: p.version });
      const n = await q.update({ unit_mass_kg: p.unitMassKg, ...(p.massSource ? { mass_source: p.massSource } : {}), version: trx.raw('version + 1'), updated_at: trx.fn.now() });
      if (!n) {
        const current = await trx('machine_part_lines').where({ id: p.lineId, production_id: productionId }).first('id', 'part_number', 'unit_mass_kg', 'version');
        throw new AppError('conflict', `Part ${current?.part_number ?? p.lineId} was changed by someone else since the draft was made. Reload it and try the draft again.`, { current });
      }
    }
    if (draft.newAssemblies.length) {
      const machine = await ensureMachine(trx, productionId);
      for (const a of draft.newAssemblies) {
        const [row] = await trx('machine_assemblies')
          .insert({ production_id: productionId, machine_id: machine.id, number: a.number, name: a.name, parent_id: a.parentId, section_id: a.sectionId })
          .returning('id');
        await trx('machine_part_lines').insert({
          production_id: productionId,
          machine_id: machine.id,
          assembly_id: row.id,
          part_number: a.number,
          name: a.name || a.number,
          quantity: 1,
          unit_mass_kg: a.massKg,
          mass_source: 'estimated',
          cog_mm: JSON.stringify(a.cogMm),
          bbox_mm: a.bboxMm ? JSON.stringify(a.bboxMm) : null,
        });
      }
    }
    for (const d of draft.venueDoors) {
      const v = await trx('venues').where({ id: d.venueId, production_id: productionId }).forUpdate().first('id', 'access');
      const access = { ...(v.access as VenueAccessData) };
      access.doors = [...access.doors];
      access.doors[d.doorIndex] = { ...access.doors[d.doorIndex], ...(d.widthMm !== undefined ? { widthMm: d.widthMm } : {}), ...(d.heightMm !== undefined ? { heightMm: d.heightMm } : {}) };
      await trx('venues').where({ id: d.venueId }).update({ access: JSON.stringify(access), version: trx.raw('version + 1'), updated_at: trx.fn.now() });
    }
    // Crate content lines follow their section or part.
    if (loaded.crateDelta.size) {
      const contents = await trx('crate_contents').where({ production_id: productionId }).whereIn('crate_id', [...loaded.crateDelta.keys()]).whereNotNull('mass_kg').select('id', 'crate_id', 'section_id', 'part_line_id', 'quantity', 'mass_kg');
      const unit = new Map(draft.partMasses.map((p) => [p.lineId, p.unitMassKg]));
      for (const c of contents) {
        let mass: number | null = null;
        if (c.section_id) {
          const a = governingKg(loaded.massAfter, c.section_id);
          const b = governingKg(loaded.massBefore, c.section_id);
          if (a !== null && b !== null && Math.abs(a - b) > 1e-9) mass = Number(c.mass_kg) + (a - b);
        } else if (c.part_line_id && unit.has(c.part_line_id)) mass = Number(c.quantity) * (unit.get(c.part_line_id) as number);
        if (mass !== null) await trx('crate_contents').where({ id: c.id }).update({ mass_kg: Math.max(0, mass), version: trx.raw('version + 1'), updated_at: trx.fn.now() });
      }
    }
    for (const h of draft.planHoists) {
      const row = await trx<PlanRow>('lift_plans').where({ id: h.planId, production_id: productionId }).first();
      if (!row) continue;
      const fields = withHoist(liftPlanFields.parse(row.inputs), h.hoistGearId);
      await updatePlan(trx, actor, productionId, row.id, row.version, fields, async (r) => ({ id: r.id, version: r.version }));
    }
    // Every plan brought up to date with the new figures: approvals the change undoes are withdrawn now.
    const ev = planEvaluator(trx, productionId);
    for (const row of await trx<PlanRow>('lift_plans').where({ production_id: productionId })) {
      if (liftPlanFields.safeParse(row.inputs).success) await refreshPlan(trx, ev, row);
    }
  });
  return impact;
}
