import type { Knex } from 'knex';
import type { CrateContentView, CrateKind, CrateView, LoadSettingsView } from '../../../src/domain/contracts/crate-loads.ts';
import { crateFigures, type CrateDesignRecord } from './crate-figures.ts';

/**
 * Rows of the crate tables and their API views. jsonb columns are written with `json()`: pg would
 * otherwise send a JS array as a PostgreSQL array. numeric columns arrive as numbers (server/db/knex.ts).
 */

type Vec3 = [number, number, number];

export interface CrateRow {
  id: string;
  production_id: string;
  code: string;
  name: string;
  kind: CrateKind;
  section_id: string | null;
  inner_length_mm: number | null;
  inner_width_mm: number | null;
  inner_height_mm: number | null;
  outer_length_mm: number;
  outer_width_mm: number;
  outer_height_mm: number;
  tare_kg: number;
  max_gross_kg: number | null;
  stackable: boolean;
  max_load_on_top_kg: number | null;
  this_way_up: boolean;
  fragile: boolean;
  may_tilt: boolean;
  ispm15_required: boolean;
  design: CrateDesignRecord;
  notes: string;
  version: number;
  updated_at: Date | string;
}

export interface ContentRow {
  id: string;
  production_id: string;
  crate_id: string;
  part_line_id: string | null;
  section_id: string | null;
  description: string;
  quantity: number;
  mass_kg: number | null;
  cog_mm: Vec3 | null;
  sort_order: number;
  version: number;
}

export interface LoadSettingsRow {
  production_id: string;
  air_divisor_cm3_per_kg: number;
  road_kg_per_loading_metre: number;
  handling_column: 'men' | 'women';
  version: number;
}

export function json(v: unknown): string | null {
  return v === null || v === undefined ? null : JSON.stringify(v);
}

export const outerOf = (r: CrateRow): Vec3 => [Number(r.outer_length_mm), Number(r.outer_width_mm), Number(r.outer_height_mm)];
export const innerOf = (r: CrateRow): Vec3 | null =>
  r.inner_length_mm === null || r.inner_width_mm === null || r.inner_height_mm === null ? null : [Number(r.inner_length_mm), Number(r.inner_width_mm), Number(r.inner_height_mm)];

export const toContentView = (c: ContentRow): CrateContentView => ({
  id: c.id,
  crateId: c.crate_id,
  partLineId: c.part_line_id,
  sectionId: c.section_id,
  description: c.description,
  quantity: Number(c.quantity),
  massKg: c.mass_kg === null ? null : Number(c.mass_kg),
  cogMm: c.cog_mm,
  version: c.version,
});

export function toCrateView(r: CrateRow, contents: ContentRow[], settings: Pick<LoadSettingsView, 'handlingColumn'>): CrateView {
  return {
    id: r.id,
    code: r.code,
    name: r.name,
    kind: r.kind,
    sectionId: r.section_id,
    innerMm: innerOf(r),
    outerMm: outerOf(r),
    tareKg: Number(r.tare_kg),
    maxGrossKg: r.max_gross_kg === null ? null : Number(r.max_gross_kg),
    stackable: r.stackable,
    maxLoadOnTopKg: r.max_load_on_top_kg === null ? null : Number(r.max_load_on_top_kg),
    thisWayUp: r.this_way_up,
    fragile: r.fragile,
    mayTilt: r.may_tilt,
    ispm15Required: r.ispm15_required,
    design: r.design ?? {},
    notes: r.notes,
    version: r.version,
    updatedAt: new Date(r.updated_at).toISOString(),
    contents: contents.map(toContentView),
    figures: crateFigures(r, contents, settings),
  };
}

export const toLoadSettingsView = (r: LoadSettingsRow): LoadSettingsView => ({
  airDivisorCm3PerKg: Number(r.air_divisor_cm3_per_kg),
  roadKgPerLoadingMetre: Number(r.road_kg_per_loading_metre),
  handlingColumn: r.handling_column,
  version: r.version,
});

/** The production's load settings, created with their defaults on first use. */
export async function ensureLoadSettings(db: Knex, productionId: string): Promise<LoadSettingsRow> {
  const row = await db<LoadSettingsRow>('load_settings').where({ production_id: productionId }).first();
  if (row) return row;
  await db('load_settings').insert({ production_id: productionId }).onConflict('production_id').ignore();
  return (await db<LoadSettingsRow>('load_settings').where({ production_id: productionId }).first())!;
}

/** Crates of a production with their contents, in code order; optionally only some ids. */
export async function loadCrates(db: Knex, productionId: string, ids?: readonly string[]): Promise<{ crate: CrateRow; contents: ContentRow[] }[]> {
  const q = db<CrateRow>('crates').where({ production_id: productionId }).orderBy('code');
  if (ids) q.whereIn('id', ids as string[]);
  const crates = await q;
  if (crates.length === 0) return [];
  const contents = await db<ContentRow>('crate_contents')
    .whereIn(
      'crate_id',
      crates.map((c) => c.id),
    )
    .orderBy(['sort_order', 'created_at']);
  const by = new Map<string, ContentRow[]>();
  for (const c of contents) by.set(c.crate_id, [...(by.get(c.crate_id) ?? []), c]);
  return crates.map((crate) => ({ crate, contents: by.get(crate.id) ?? [] }));
}
