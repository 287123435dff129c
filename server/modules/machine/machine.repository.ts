import type { Knex } from 'knex';
import type {
  AddOnView,
  AssemblyView,
  MachineView,
  MaterialView,
  MeshView,
  PartLineView,
  SectionView,
  WeighingView,
} from '../../../src/domain/contracts/machine.ts';
import type { MassSource, PartInstance } from '../../../src/domain/contracts/mass.ts';
import { DEFAULT_MATERIALS } from '../../../src/domain/mass/index.ts';

/**
 * Rows of the machine tables and their API views. jsonb columns (CoG, boxes, tensors) are written with
 * `json()`: pg would otherwise send a JS array as a PostgreSQL array.
 */

type Vec3 = [number, number, number];
type Box = { minMm: Vec3; maxMm: Vec3 };

export interface MachineRow {
  id: string;
  production_id: string;
  name: string;
  margin_percent: number;
  import_mapping: Record<string, unknown>;
  version: number;
  updated_at: Date;
}
export interface SectionRow {
  id: string;
  production_id: string;
  machine_id: string;
  code: string;
  name: string;
  margin_percent: number | null;
  cog_uncertainty_mm: number | null;
  sort_order: number;
  version: number;
}
export interface AssemblyRow {
  id: string;
  production_id: string;
  machine_id: string;
  number: string;
  name: string;
  parent_id: string | null;
  section_id: string | null;
  keep_together: boolean;
  notes: string;
  sort_order: number;
  version: number;
}
export interface PartLineRow {
  id: string;
  production_id: string;
  machine_id: string;
  assembly_id: string | null;
  section_id: string | null;
  part_number: string;
  name: string;
  quantity: number;
  unit_mass_kg: number | null;
  mass_source: MassSource | null;
  material: string | null;
  make_or_buy: 'made' | 'bought' | null;
  value: number | null;
  currency: string | null;
  country_of_origin: string | null;
  serial_numbers: string[];
  cog_mm: Vec3 | null;
  bbox_mm: Box | null;
  inertia_kg_mm2: number[][] | null;
  notes: string;
  sort_order: number;
  version: number;
}
export interface InstanceRow {
  part_line_id: string;
  seq: number;
  x_mm: number;
  y_mm: number;
  z_mm: number;
  rz_deg: number;
  ry_deg: number;
  rx_deg: number;
}
export interface AddOnRow {
  id: string;
  production_id: string;
  section_id: string;
  name: string;
  mass_kg: number | null;
  mass_source: MassSource | null;
  cog_mm: Vec3 | null;
  bbox_mm: Box | null;
  notes: string;
  version: number;
}
export interface MaterialRow {
  id: string;
  production_id: string;
  code: string;
  name: string;
  density_kg_per_m3: number;
  source: string;
  version: number;
}
export interface WeighingRow {
  id: string;
  production_id: string;
  section_id: string;
  weighed_on: Date | string;
  weighed_by: string;
  scale: string;
  readings: { positionMm: [number, number]; readingKg: number }[];
  mass_kg: number;
  cog_plan_mm: [number, number] | null;
  derived_notes: string[];
  notes: string;
  version: number;
  created_at: Date;
}
export interface MeshRow {
  id: string;
  production_id: string;
  part_line_id: string;
  file_name: string;
  length_unit: 'mm' | 'cm' | 'm' | 'in';
  size_bytes: number;
  triangle_count: number;
  volume_mm3: number;
  material: string | null;
  density_kg_per_m3: number | null;
  mass_kg: number | null;
  cog_mm: Vec3;
  bbox_mm: Box;
  flipped: boolean;
}

/** A value for a jsonb column (null stays SQL null). */
export function json(v: unknown): string | null {
  return v === null || v === undefined ? null : JSON.stringify(v);
}

const iso = (d: Date | string) => new Date(d).toISOString();
/** A `date` column as YYYY-MM-DD, whatever the pg type parser made of it. */
function isoDate(d: Date | string): string {
  if (typeof d === 'string') return d.slice(0, 10);
  const y = d.getFullYear();
  const m = String(d.getMonth() + 1).padStart(2, '0');
  const day = String(d.getDate()).padStart(2, '0');
  return `${y}-${m}-${day}`;
}

export const toMachineView = (r: MachineRow): MachineView => ({
  id: r.id,
  name: r.name,
  marginPercent: Number(r.margin_percent),
  version: r.version,
  updatedAt: iso(r.updated_at),
});
export const toSectionView = (r: SectionRow): SectionView => ({
  id: r.id,
  code: r.code,
  name: r.name,
  marginPercent: r.margin_percent,
  cogUncertaintyMm: r.cog_uncertainty_mm,
  sortOrder: r.sort_order,
  version: r.version,
});
export const toAssemblyView = (r: AssemblyRow): AssemblyView => ({
  id: r.id,
  number: r.number,
  name: r.name,
  parentId: r.parent_id,
  sectionId: r.section_id,
  keepTogether: r.keep_together,
  notes: r.notes,
  version: r.version,
});
export function toInstance(r: InstanceRow): PartInstance {
  return { positionMm: [r.x_mm, r.y_mm, r.z_mm], eulerZyxDeg: [r.rz_deg, r.ry_deg, r.rx_deg] };
}
export function toPartLineView(r: PartLineRow, instances: PartInstance[] = [], hasMesh = false): PartLineView {
  return {
    id: r.id,
    assemblyId: r.assembly_id,
    sectionId: r.section_id,
    partNumber: r.part_number,
    name: r.name,
    quantity: Number(r.quantity),
    unitMassKg: r.unit_mass_kg,
    massSource: r.mass_source,
    material: r.material,
    makeOrBuy: r.make_or_buy,
    value: r.value,
    currency: r.currency,
    countryOfOrigin: r.country_of_origin,
    serialNumbers: r.serial_numbers ?? [],
    cogMm: r.cog_mm,
    bboxMm: r.bbox_mm,
    inertiaKgMm2: r.inertia_kg_mm2,
    instances,
    notes: r.notes,
    hasMesh,
    version: r.version,
  };
}
export const toAddOnView = (r: AddOnRow): AddOnView => ({
  id: r.id,
  sectionId: r.section_id,
  name: r.name,
  massKg: r.mass_kg,
  massSource: r.mass_source,
  cogMm: r.cog_mm,
  bboxMm: r.bbox_mm,
  notes: r.notes,
  version: r.version,
});
export const toMaterialView = (r: MaterialRow): MaterialView => ({
  id: r.id,
  code: r.code,
  name: r.name,
  densityKgPerM3: r.density_kg_per_m3,
  source: r.source,
  version: r.version,
});
export const toWeighingView = (r: WeighingRow): WeighingView => ({
  id: r.id,
  sectionId: r.section_id,
  weighedOn: isoDate(r.weighed_on),
  weighedBy: r.weighed_by,
  scale: r.scale,
  readings: r.readings,
  massKg: r.mass_kg,
  cogPlanMm: r.cog_plan_mm,
  derivedNotes: r.derived_notes ?? [],
  notes: r.notes,
  version: r.version,
  createdAt: iso(r.created_at),
});
export const toMeshView = (r: MeshRow): MeshView => ({
  id: r.id,
  partLineId: r.part_line_id,
  fileName: r.file_name,
  lengthUnit: r.length_unit,
  sizeBytes: r.size_bytes,
  triangleCount: r.triangle_count,
  volumeMm3: r.volume_mm3,
  material: r.material,
  densityKgPerM3: r.density_kg_per_m3,
  massKg: r.mass_kg,
  cogMm: r.cog_mm,
  bboxMm: r.bbox_mm,
  flipped: r.flipped,
});

/** Columns of a part line as written from API fields (camelCase → snake_case, jsonb encoded). */
export function partLineColumns(b: Partial<PartLineView>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  const set = (key: keyof PartLineView, col: string, f: (v: never) => unknown = (v) => v) => {
    if (b[key] !== undefined) out[col] = f(b[key] as never);
  };
  set('assemblyId', 'assembly_id');
  set('sectionId', 'section_id');
  set('partNumber', 'part_number');
  set('name', 'name');
  set('quantity', 'quantity');
  set('unitMassKg', 'unit_mass_kg');
  set('massSource', 'mass_source');
  set('material', 'material');
  set('makeOrBuy', 'make_or_buy');
  set('value', 'value');
  set('currency', 'currency');
  set('countryOfOrigin', 'country_of_origin');
  set('serialNumbers', 'serial_numbers');
  set('cogMm', 'cog_mm', json);
  set('bboxMm', 'bbox_mm', json);
  set('inertiaKgMm2', 'inertia_kg_mm2', json);
  set('notes', 'notes');
  return out;
}

export function instanceRows(productionId: string, partLineId: string, instances: PartInstance[]): Record<string, unknown>[] {
  return instances.map((inst, seq) => ({
    production_id: productionId,
    part_line_id: partLineId,
    seq,
    x_mm: inst.positionMm[0],
    y_mm: inst.positionMm[1],
    z_mm: inst.positionMm[2],
    rz_deg: inst.eulerZyxDeg?.[0] ?? 0,
    ry_deg: inst.eulerZyxDeg?.[1] ?? 0,
    rx_deg: inst.eulerZyxDeg?.[2] ?? 0,
  }));
}

/**
 * The production's machine, created on first use with a copy of the core's default materials table, so a
 * planner can start adding parts at once. Safe under concurrent first requests (insert … on conflict).
 */
export async function ensureMachine(db: Knex, productionId: string, name = ''): Promise<MachineRow> {
  const existing = await db<MachineRow>('machines').where({ production_id: productionId }).first();
  if (existing) return existing;
  return db.transaction(async (trx) => {
    const [inserted] = await trx('machines').insert({ production_id: productionId, name }).onConflict('production_id').ignore().returning('*');
    if (inserted) {
      await trx('machine_materials')
        .insert(DEFAULT_MATERIALS.map((m) => ({ production_id: productionId, code: m.code, name: m.name, density_kg_per_m3: m.densityKgPerM3, source: m.source })))
        .onConflict(['production_id', 'code'])
        .ignore();
      return inserted as MachineRow;
    }
    return (await trx<MachineRow>('machines').where({ production_id: productionId }).first())!;
  });
}

/** Instances of many lines, grouped by line id, in their order. */
export async function instancesByLine(db: Knex, productionId: string, lineIds?: string[]): Promise<Map<string, PartInstance[]>> {
  const q = db('machine_part_instances').where({ production_id: productionId });
  if (lineIds) q.whereIn('part_line_id', lineIds);
  const rows = (await q.orderBy(['part_line_id', 'seq'])) as InstanceRow[];
  const out = new Map<string, PartInstance[]>();
  for (const r of rows) {
    const list = out.get(r.part_line_id) ?? [];
    list.push(toInstance(r));
    out.set(r.part_line_id, list);
  }
  return out;
}
