import { allQueries } from '../../db/parallel.ts';
import type { Knex } from 'knex';
import type { LiftLoadView } from '../../../src/domain/contracts/lifting-api.ts';
import { machineMass, type MachineMass } from '../machine/mass.service.ts';
import type { SectionRow } from '../machine/machine.repository.ts';

/**
 * Sections as loads for lift plans and manual handling, read from the machine breakdown: the mass
 * and CoG the mass core computed, or the latest weighing where there is one (a weighed mass needs
 * no contingency; its CoG in plan comes from the load cells, its height from the breakdown).
 */
export interface SectionLoads {
  loads: LiftLoadView[];
  byId: Map<string, LiftLoadView>;
  mass: MachineMass;
}

export async function sectionLoads(db: Knex, productionId: string): Promise<SectionLoads> {
  const [mass, sections] = await allQueries(db, [
    () => machineMass(db, productionId),
    () => db<SectionRow>('machine_sections').where({ production_id: productionId }).orderBy(['sort_order', 'code']),
  ]);
  const loads = sections.map((s) => sectionLoad(s, mass));
  return { loads, byId: new Map(loads.map((l) => [l.sectionId, l])), mass };
}

/** One section as a lift load: the weighing's mass and CoG in plan where there is one, else the mass core's. */
export function sectionLoad(s: SectionRow, mass: MachineMass): LiftLoadView {
  const m = mass.sections[s.id];
  const w = m?.weighing ?? null;
  const cog = m?.cogMm ?? null;
  const weighedCog: [number, number, number] | null = w?.cogPlanMm && cog ? [w.cogPlanMm[0], w.cogPlanMm[1], cog[2]] : cog;
  return {
    sectionId: s.id,
    code: s.code,
    name: s.name,
    massKg: w ? w.massKg : m && m.massKg > 0 ? m.massKg : null,
    marginPercent: w ? 0 : (m?.marginPercent ?? 0),
    weighed: Boolean(w),
    weighedOn: w?.weighedOn ?? null,
    cogMm: w ? weighedCog : cog,
    cogUncertaintyMm: s.cog_uncertainty_mm === null ? null : Number(s.cog_uncertainty_mm),
    boundsMm: m?.bboxMm ?? null,
    // A weighing settles the mass even where parts lack figures.
    complete: w ? true : (m?.complete ?? false),
    gapCount: w ? 0 : (m?.gaps.length ?? 0),
  };
}
