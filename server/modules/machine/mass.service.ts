import { allQueries } from '../../db/parallel.ts';
import type { Knex } from 'knex';
import type { MassPropertiesInput, MassPartLine } from '../../../src/domain/contracts/mass.ts';
import { compareWeighing, massProperties, type MassPropertiesResult, type NodeMassProperties, type WeighingComparison } from '../../../src/domain/mass/index.ts';
import { invalid } from '../../http/errors.ts';
import { cacheFor, machineFingerprint, type FingerprintCache } from '../../db/revision-cache.ts';
import {
  ensureMachine,
  instancesByLine,
  toWeighingView,
  type AddOnRow,
  type AssemblyRow,
  type PartLineRow,
  type SectionRow,
  type WeighingRow,
} from './machine.repository.ts';
import type { WeighingView } from '../../../src/domain/contracts/machine.ts';

/**
 * The machine as the mass core sees it, read in four queries, and its mass properties. The server is the
 * authority: the client computes the same function on the same input only for instant previews.
 */
export async function loadMassInput(db: Knex, productionId: string): Promise<MassPropertiesInput & { sectionMargins: Record<string, number | null> }> {
  const machine = await ensureMachine(db, productionId);
  const [sections, assemblies, lines, addOns, instances] = await allQueries(db, [
    () => db<SectionRow>('machine_sections').where({ production_id: productionId }).orderBy(['sort_order', 'code']),
    () => db<AssemblyRow>('machine_assemblies').where({ production_id: productionId }).orderBy(['sort_order', 'number']),
    () => db<PartLineRow>('machine_part_lines')
      .where({ production_id: productionId })
      .orderBy(['sort_order', 'part_number'])
      .select('id', 'part_number', 'assembly_id', 'section_id', 'quantity', 'unit_mass_kg', 'mass_source', 'cog_mm', 'bbox_mm', 'inertia_kg_mm2'),
    () => db<AddOnRow>('machine_section_add_ons').where({ production_id: productionId }).orderBy('name'),
    () => instancesByLine(db, productionId),
  ]);
  return {
    marginPercent: Number(machine.margin_percent),
    sections: sections.map((s) => ({ id: s.id, label: s.code })),
    sectionMargins: Object.fromEntries(sections.map((s) => [s.id, s.margin_percent])),
    assemblies: assemblies.map((a) => ({ id: a.id, label: a.number, parentId: a.parent_id, sectionId: a.section_id })),
    lines: lines.map((l): MassPartLine => {
      const inst = instances.get(l.id);
      return {
        id: l.id,
        label: l.part_number,
        assemblyId: l.assembly_id,
        sectionId: l.section_id,
        quantity: Number(l.quantity),
        unitMassKg: l.unit_mass_kg,
        massSource: l.mass_source,
        cogMm: l.cog_mm,
        bboxMm: l.bbox_mm,
        inertiaKgMm2: l.inertia_kg_mm2,
        ...(inst && inst.length > 0 ? { instances: inst } : {}),
      };
    }),
    addOns: addOns.map((a) => ({
      id: a.id,
      label: a.name,
      sectionId: a.section_id,
      massKg: a.mass_kg,
      massSource: a.mass_source,
      cogMm: a.cog_mm,
      bboxMm: a.bbox_mm,
    })),
  };
}

export interface SectionMass extends NodeMassProperties {
  /** The margin that applies to this section (its own, else the machine's), %. */
  marginPercent: number;
  /** The latest weighing, which governs over the computed figures, and how far apart they are. */
  weighing: (WeighingView & { comparison: WeighingComparison | null }) | null;
}

export interface MachineMass {
  marginPercent: number;
  sections: Record<string, SectionMass>;
  assemblies: MassPropertiesResult['assemblies'];
  loose: NodeMassProperties;
  machine: NodeMassProperties;
  total: NodeMassProperties;
  gaps: MassPropertiesResult['gaps'];
  warnings: MassPropertiesResult['warnings'];
}

/**
 * Runs the core on the input; a section with its own margin gets its own mass with margin. A structural
 * problem the database cannot hold (it keeps ids and parents consistent) would surface as 400 naming it.
 */
export function computeMachineMass(
  input: MassPropertiesInput & { sectionMargins: Record<string, number | null> },
  latestWeighings: Map<string, WeighingView> = new Map(),
): MachineMass {
  let result: MassPropertiesResult;
  try {
    result = massProperties(input);
  } catch (e) {
    throw invalid(`The breakdown cannot be computed: ${(e as Error).message}`);
  }
  const machineMargin = result.marginPercent;
  const sections: Record<string, SectionMass> = {};
  for (const [id, node] of Object.entries(result.sections)) {
    const marginPercent = input.sectionMargins[id] ?? machineMargin;
    const w = latestWeighings.get(id);
    let comparison: WeighingComparison | null = null;
    if (w) {
      try {
        comparison = compareWeighing({ massKg: node.massKg, cogMm: node.cogMm }, { massKg: w.massKg, cogPlanMm: w.cogPlanMm });
      } catch {
        comparison = null;
      }
    }
    sections[id] = { ...node, marginPercent, massWithMarginKg: node.massKg * (1 + marginPercent / 100), weighing: w ? { ...w, comparison } : null };
  }
  return {
    marginPercent: machineMargin,
    sections,
    assemblies: result.assemblies,
    loose: result.loose,
    machine: result.machine,
    total: result.total,
    gaps: result.gaps,
    warnings: result.warnings,
  };
}

/** The latest weighing of each section (by date, then by when it was recorded). */
export async function latestWeighings(db: Knex, productionId: string): Promise<Map<string, WeighingView>> {
  const rows = await db<WeighingRow>('machine_weighings')
    .where({ production_id: productionId })
    .distinctOn('section_id')
    .orderBy([{ column: 'section_id' }, { column: 'weighed_on', order: 'desc' }, { column: 'created_at', order: 'desc' }]);
  return new Map(rows.map((r) => [r.section_id, toWeighingView(r)]));
}

const massCaches = new WeakMap<Knex, FingerprintCache<MachineMass>>();

/**
 * The machine's mass properties, computed once per state of its breakdown (server/db/revision-cache.ts): reading every
 * part line and running the core took tens of milliseconds for 5,000 lines, checking that nothing changed
 * takes one short query. The value is shared and frozen: callers read it, never change it.
 */
export async function machineMass(db: Knex, productionId: string): Promise<MachineMass> {
  const fingerprint = await machineFingerprint(db, productionId);
  return cacheFor(massCaches, db, 20).get(productionId, fingerprint, async () => {
    const [input, weighings] = await allQueries(db, [() => loadMassInput(db, productionId), () => latestWeighings(db, productionId)]);
    return computeMachineMass(input, weighings);
  });
}
