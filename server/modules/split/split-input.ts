import { allQueries } from '../../db/parallel.ts';
import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import type { SplitInputView } from '../../../src/domain/contracts/split.ts';
import { combineMasses, rotateVec, rotationFromEulerZyxDeg, type PointMass } from '../../../src/domain/mass/index.ts';
import type { SplitAssembly, SplitPart } from '../../../src/domain/split/index.ts';
import { ensureMachine, instancesByLine, type AssemblyRow, type PartLineRow, type SectionRow } from '../machine/machine.repository.ts';

type Vec3 = [number, number, number];

/** Stands for the lines hung on no assembly, so that they too land in exactly one section. */
export const LOOSE_ASSEMBLY_ID = 'machine-loose-parts';

interface Own {
  masses: PointMass[];
  min: Vec3;
  max: Vec3;
  count: number;
}

function grow(o: Own, min: Vec3, max: Vec3): void {
  for (let i = 0; i < 3; i++) {
    o.min[i] = Math.min(o.min[i], min[i]);
    o.max[i] = Math.max(o.max[i], max[i]);
  }
  o.count++;
}

/** The axis-aligned box around a local box turned by `r` and moved by `p` (centre and |R|·half size). */
function turnedBox(min: Vec3, max: Vec3, r: ReturnType<typeof rotationFromEulerZyxDeg>, p: Vec3): { min: Vec3; max: Vec3 } {
  const c: Vec3 = [(min[0] + max[0]) / 2, (min[1] + max[1]) / 2, (min[2] + max[2]) / 2];
  const h: Vec3 = [(max[0] - min[0]) / 2, (max[1] - min[1]) / 2, (max[2] - min[2]) / 2];
  const rc = rotateVec(r, c);
  const outMin: Vec3 = [0, 0, 0];
  const outMax: Vec3 = [0, 0, 0];
  for (let i = 0; i < 3; i++) {
    const half = Math.abs(r[i][0]) * h[0] + Math.abs(r[i][1]) * h[1] + Math.abs(r[i][2]) * h[2];
    outMin[i] = rc[i] + p[i] - half;
    outMax[i] = rc[i] + p[i] + half;
  }
  return { min: outMin, max: outMax };
}

export interface SplitSource extends SplitInputView {
  /** For the advisor core. */
  core: { assemblies: SplitAssembly[]; parts: SplitPart[] };
}

/**
 * The breakdown as the split core takes it. Each part line is placed the way the mass core places it
 * (instances turned and moved; without instances all units at the line's CoG, in the machine frame) and the
 * parts hung directly on one assembly are summed into one part: the core only ever uses an assembly's own
 * parts together (their mass, first moments and extent), so the answer is the same and the search input
 * stays small. A line with no mass or no position is a gap: counted as zero and listed.
 */
export async function loadSplitSource(db: Knex, productionId: string): Promise<SplitSource> {
  const machine = await ensureMachine(db, productionId);
  const [assemblies, lines, sections, instances] = await allQueries(db, [
    () => db<AssemblyRow>('machine_assemblies').where({ production_id: productionId }).orderBy(['sort_order', 'number']),
    () => db<PartLineRow>('machine_part_lines').where({ production_id: productionId }).orderBy(['sort_order', 'part_number']).select('id', 'part_number', 'assembly_id', 'quantity', 'unit_mass_kg', 'cog_mm', 'bbox_mm', 'version'),
    () => db<SectionRow>('machine_sections').where({ production_id: productionId }).orderBy(['sort_order', 'code']),
    () => instancesByLine(db, productionId),
  ]);
  const own = new Map<string, Own>();
  const gaps: string[] = [];
  const ownOf = (id: string) => {
    let o = own.get(id);
    if (!o) {
      o = { masses: [], min: [Infinity, Infinity, Infinity], max: [-Infinity, -Infinity, -Infinity], count: 0 };
      own.set(id, o);
    }
    return o;
  };
  let looseCount = 0;
  for (const l of lines) {
    const assemblyId = l.assembly_id ?? LOOSE_ASSEMBLY_ID;
    if (!l.assembly_id) looseCount++;
    const q = Number(l.quantity);
    const m = l.unit_mass_kg === null ? null : Number(l.unit_mass_kg);
    const inst = instances.get(l.id) ?? [];
    const cog = l.cog_mm;
    if (m === null || !cog) {
      gaps.push(`Part ${l.part_number}: ${m === null ? 'no mass' : 'no position'}; counted as 0 kg until it is known.`);
    }
    const o = ownOf(assemblyId);
    const box = l.bbox_mm;
    if (inst.length > 0) {
      for (const it of inst) {
        const r = rotationFromEulerZyxDeg(it.eulerZyxDeg ?? [0, 0, 0]);
        const p = it.positionMm as Vec3;
        const c = cog ? (rotateVec(r, cog) as Vec3).map((v, i) => v + p[i]) as Vec3 : p;
        if (m !== null && cog && m > 0) o.masses.push({ massKg: m, cogMm: c });
        const b = box ? turnedBox(box.minMm, box.maxMm, r, p) : { min: c, max: c };
        grow(o, b.min, b.max);
      }
    } else if (cog || box) {
      const c: Vec3 = cog ?? [(box!.minMm[0] + box!.maxMm[0]) / 2, (box!.minMm[1] + box!.maxMm[1]) / 2, (box!.minMm[2] + box!.maxMm[2]) / 2];
      if (m !== null && cog && m * q > 0) o.masses.push({ massKg: m * q, cogMm: c });
      grow(o, box ? box.minMm : c, box ? box.maxMm : c);
    }
  }
  if (looseCount > 0) gaps.push(`${looseCount} part line(s) hang on no assembly: the advisor keeps them together as "${LOOSE_ASSEMBLY_ID}".`);

  const coreAssemblies: SplitAssembly[] = assemblies.map((a) => ({ id: a.id, parentId: a.parent_id, keepTogether: a.keep_together }));
  if (own.has(LOOSE_ASSEMBLY_ID)) coreAssemblies.push({ id: LOOSE_ASSEMBLY_ID, parentId: null, keepTogether: true });
  const parts: SplitPart[] = [];
  for (const [assemblyId, o] of own) {
    if (o.count === 0) continue;
    const total = o.masses.length > 0 ? combineMasses(o.masses) : null;
    const cog: Vec3 = total && total.massKg > 0 ? (total.cogMm as Vec3) : [(o.min[0] + o.max[0]) / 2, (o.min[1] + o.max[1]) / 2, (o.min[2] + o.max[2]) / 2];
    parts.push({ assemblyId, massKg: total?.massKg ?? 0, cogMm: cog, bboxMinMm: o.min, bboxMaxMm: o.max });
  }
  parts.sort((a, b) => (a.assemblyId < b.assemblyId ? -1 : 1));

  const stamp = createHash('sha256')
    .update(`${machine.version}|`)
    .update(assemblies.map((a) => `${a.id}:${a.version}`).sort().join(','))
    .update('|')
    .update(lines.map((l) => `${l.id}:${l.version}`).sort().join(','))
    .digest('hex')
    .slice(0, 32);

  const views = assemblies.map((a) => ({ id: a.id, number: a.number, name: a.name, parentId: a.parent_id, keepTogether: a.keep_together, sectionId: a.section_id }));
  if (own.has(LOOSE_ASSEMBLY_ID)) views.push({ id: LOOSE_ASSEMBLY_ID, number: '(loose)', name: 'Parts on no assembly', parentId: null, keepTogether: true, sectionId: null });
  return {
    machineVersion: machine.version,
    stamp,
    assemblies: views,
    parts,
    sections: sections.map((s) => ({ id: s.id, code: s.code, name: s.name })),
    gaps,
    lineCount: lines.length,
    core: { assemblies: coreAssemblies, parts },
  };
}
