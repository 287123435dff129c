import type { Knex } from 'knex';
import { assessHandling, type HandlingAssessment, type HandlingSubject } from '../../../src/domain/contracts/handling-tasks.ts';
import { handlingTaskInput, type HandlingTaskBody, type HandlingTaskInput } from '../../../src/domain/contracts/lifting-api.ts';
import { AppError, invalid } from '../../http/errors.ts';
import { sectionLoads } from './lift-loads.ts';
import { ensureSettings, toSettingsView, type HandlingTaskRow } from './lifting.repository.ts';

/**
 * Manual-handling verdicts for every section, loose part and crate heavier than the production's
 * threshold: the subject's mass and size from the breakdown and the crates, the crew's task inputs
 * (estimates for the rest) and the core's verdict with its working.
 */

export interface HandlingItemView extends HandlingSubject {
  task: HandlingTaskInput | null;
  /** Version of the saved task; 0 while none is saved. */
  version: number;
  assessment: HandlingAssessment;
}

const sizeOf = (b: { minMm: number[]; maxMm: number[] } | null | undefined): [number, number, number] | null =>
  b ? [b.maxMm[0] - b.minMm[0], b.maxMm[1] - b.minMm[1], b.maxMm[2] - b.minMm[2]] : null;

/** Sections, loose parts and crates as handled items, lightest threshold applied. */
export async function handlingSubjects(db: Knex, productionId: string, thresholdKg: number): Promise<HandlingSubject[]> {
  const { loads, mass } = await sectionLoads(db, productionId);
  const out: HandlingSubject[] = [];
  for (const l of loads) {
    const m = mass.sections[l.sectionId];
    // Handling uses the mass with its contingency until the section is weighed: the safe side.
    const massKg = l.massKg === null ? null : l.weighed ? l.massKg : (m?.massWithMarginKg ?? l.massKg);
    const note = l.massKg === null
      ? 'mass unknown: nothing with a mass is counted in this section yet'
      : l.weighed
        ? `weighed ${l.weighedOn}`
        : `computed from the breakdown, with a ${l.marginPercent} % margin${l.complete ? '' : `; ${l.gapCount} gap(s), so a lower bound`}`;
    if (massKg !== null && massKg <= thresholdKg) continue;
    out.push({ kind: 'section', id: l.sectionId, code: l.code, label: l.name, massKg: l.complete || l.massKg === null ? massKg : null, massNote: note, sizeMm: sizeOf(l.boundsMm) });
  }
  const loose = await db('machine_part_lines')
    .where({ production_id: productionId })
    .whereNull('section_id')
    .andWhere((q) => q.whereNull('unit_mass_kg').orWhere('unit_mass_kg', '>', thresholdKg))
    .orderBy(['sort_order', 'part_number'])
    .select('id', 'part_number', 'name', 'unit_mass_kg', 'mass_source', 'bbox_mm', 'quantity');
  for (const p of loose) {
    out.push({
      kind: 'loose-part',
      id: p.id,
      code: p.part_number,
      label: `${p.name || p.part_number}${Number(p.quantity) > 1 ? ` (each of ${Number(p.quantity)})` : ''}`,
      massKg: p.unit_mass_kg,
      massNote: p.unit_mass_kg === null ? 'unit mass unknown' : `unit mass, ${p.mass_source ?? 'source not given'}`,
      sizeMm: sizeOf(p.bbox_mm),
    });
  }
  const crates = await db('crates').where({ production_id: productionId }).orderBy('code').select('id', 'code', 'name', 'tare_kg', 'outer_length_mm', 'outer_width_mm', 'outer_height_mm');
  if (crates.length) {
    const contents = await db('crate_contents').where({ production_id: productionId }).select('crate_id', 'mass_kg', 'description');
    for (const c of crates) {
      const mine = contents.filter((x) => x.crate_id === c.id);
      const unknown = mine.filter((x) => x.mass_kg === null);
      const gross = Number(c.tare_kg) + mine.reduce((a, x) => a + Number(x.mass_kg ?? 0), 0);
      if (unknown.length === 0 && gross <= thresholdKg) continue;
      out.push({
        kind: 'crate',
        id: c.id,
        code: c.code,
        label: c.name || c.code,
        massKg: unknown.length ? null : gross,
        massNote: unknown.length ? `gross mass unknown: ${unknown.length} content line(s) without a mass` : `gross: tare ${Number(c.tare_kg)} kg + ${mine.length} content line(s)`,
        sizeMm: [Number(c.outer_length_mm), Number(c.outer_width_mm), Number(c.outer_height_mm)],
      });
    }
  }
  return out;
}

export async function handlingList(db: Knex, productionId: string) {
  const settingsRow = await ensureSettings(db, productionId);
  const settings = toSettingsView(settingsRow);
  const [subjects, tasks] = await Promise.all([
    handlingSubjects(db, productionId, settings.handlingThresholdKg),
    db<HandlingTaskRow>('handling_tasks').where({ production_id: productionId }),
  ]);
  const byKey = new Map(tasks.map((t) => [`${t.item_kind}:${t.item_id}`, t]));
  const items: HandlingItemView[] = subjects.map((s) => {
    const row = byKey.get(`${s.kind}:${s.id}`);
    const parsed = row ? handlingTaskInput.safeParse(row.task) : null;
    const task = parsed?.success ? parsed.data : null;
    return { ...s, task, version: row?.version ?? 0, assessment: assessHandling(s, task, settings) };
  });
  return { settings, items };
}

/** Saves the task of one item (version 0 = first save). 409 with the current task when stale. */
export async function saveHandlingTask(db: Knex, productionId: string, itemId: string, body: HandlingTaskBody, userId: string) {
  const table = body.itemKind === 'section' ? 'machine_sections' : body.itemKind === 'crate' ? 'crates' : 'machine_part_lines';
  const exists = await db(table).where({ id: itemId, production_id: productionId }).first('id');
  if (!exists) throw new AppError('not_found', `No ${body.itemKind} with that id in this production.`);
  return db.transaction(async (trx) => {
    const row = await trx<HandlingTaskRow>('handling_tasks').where({ production_id: productionId, item_kind: body.itemKind, item_id: itemId }).forUpdate().first();
    const current = row ? { task: row.task, version: row.version } : { task: null, version: 0 };
    if ((row?.version ?? 0) !== body.version) {
      throw new AppError('conflict', 'Someone else saved this task in the meantime. Reload to see their version, or keep yours and save again.', { current });
    }
    if (!row) {
      const [ins] = await trx('handling_tasks')
        .insert({ production_id: productionId, item_kind: body.itemKind, item_id: itemId, task: JSON.stringify(body.task), updated_by: userId })
        .returning(['task', 'version']);
      return ins as { task: HandlingTaskInput; version: number };
    }
    const [up] = await trx('handling_tasks')
      .where({ id: row.id })
      .update({ task: JSON.stringify(body.task), updated_by: userId, version: trx.raw('version + 1'), updated_at: trx.fn.now() })
      .returning(['task', 'version']);
    return up as { task: HandlingTaskInput; version: number };
  });
}

export function badItemKind(kind: string): never {
  throw invalid('Some fields are not valid.', [{ path: 'itemKind', message: `Unknown item kind "${kind}".` }]);
}
