import type { Knex } from 'knex';
import type { CreateCrateBody } from '../../../src/domain/contracts/crate-loads.ts';
import {
  designCrate,
  ispm15Need,
  EUR_PALLET,
  ISO_6780_PALLETS,
  STOCK_CASES,
  type CrateDesign,
  type CrateDesignOptions,
  type StockItem,
} from '../../../src/domain/crates/index.ts';
import { add } from '../../../src/domain/geometry/vec3.ts';
import { invalid, notFound } from '../../http/errors.ts';
import { machineMass } from '../machine/mass.service.ts';

type Vec3 = [number, number, number];

/** The stock catalogue: EUR pallet, ISO 6780 pallets, stock cases and cartons (src/domain/crates/stock.ts). */
export const STOCK_CATALOGUE: readonly StockItem[] = [EUR_PALLET, ...ISO_6780_PALLETS, ...STOCK_CASES];

export function stockItem(id: string): StockItem {
  const s = STOCK_CATALOGUE.find((i) => i.id === id);
  if (!s) throw invalid(`Stock item "${id}" is not in the catalogue.`, [{ path: 'stockId', message: `Unknown catalogue entry "${id}".` }]);
  return s;
}

export interface SectionForCrate {
  id: string;
  code: string;
  name: string;
  massKg: number;
  massSource: string;
  cogMm: Vec3;
  bboxMinMm: Vec3;
  bboxMaxMm: Vec3;
}

/**
 * A section as the crate core takes it, from the machine's mass properties (the server's authority).
 * Mass: the latest weighing where there is one (it governs), else the computed mass with its margin, so
 * the crate is sized and marked on the safe side. No CoG or box yet: 400 naming the section.
 */
export async function sectionForCrate(db: Knex, productionId: string, sectionId: string): Promise<SectionForCrate> {
  const row = await db('machine_sections').where({ id: sectionId, production_id: productionId }).first('id', 'code', 'name');
  if (!row) throw invalid('No such section in this production.', [{ path: 'sectionId', message: 'Pick a section of this production.' }]);
  const mass = await machineMass(db, productionId);
  const node = mass.sections[sectionId];
  if (!node || !node.cogMm || !node.bboxMm || !(node.massKg > 0)) {
    throw invalid(`Section ${row.code} has no mass, CoG or size yet: complete its parts before designing a crate around it.`, [
      { path: 'sectionId', message: `Section ${row.code} has no mass, CoG or bounding box yet.` },
    ]);
  }
  const weighed = node.weighing?.massKg;
  return {
    id: row.id,
    code: row.code,
    name: row.name,
    massKg: weighed ?? node.massWithMarginKg,
    massSource: weighed !== undefined ? 'weighed' : `computed with ${node.marginPercent} % margin`,
    cogMm: node.cogMm as Vec3,
    bboxMinMm: node.bboxMm.minMm as Vec3,
    bboxMaxMm: node.bboxMm.maxMm as Vec3,
  };
}

/** Crate columns of a designed crate and its section content line, from the core's design. */
export function designedColumns(section: SectionForCrate, options: CrateDesignOptions | undefined) {
  let d: CrateDesign;
  try {
    d = designCrate({ id: section.code, name: section.name, massKg: section.massKg, cogMm: section.cogMm, bboxMinMm: section.bboxMinMm, bboxMaxMm: section.bboxMaxMm }, options ?? {});
  } catch (e) {
    throw invalid(`The crate cannot be designed: ${(e as Error).message}`, [{ path: 'designOptions', message: (e as Error).message }]);
  }
  const columns = {
    inner_length_mm: d.innerMm[0],
    inner_width_mm: d.innerMm[1],
    inner_height_mm: d.innerMm[2],
    outer_length_mm: d.outerMm[0],
    outer_width_mm: d.outerMm[1],
    outer_height_mm: d.outerMm[2],
    tare_kg: d.tareKg,
    max_gross_kg: d.maxGrossKg ?? null,
    stackable: d.stackable,
    max_load_on_top_kg: d.maxLoadOnTopKg,
    this_way_up: d.thisWayUp,
    fragile: d.fragile,
    ispm15_required: ispm15Need(d.makeUp, true, options?.materials).needed,
    design: JSON.stringify({
      options: options ?? {},
      makeUp: d.makeUp,
      clearance: d.clearance,
      components: d.components,
      tareCogMm: d.tareCogMm,
      sectionOffsetMm: d.sectionOffsetMm,
      forkEntryHeightMm: d.forkEntryHeightMm,
      forkEntryGapMm: d.forkEntryGapMm,
      standard: d.standard ?? null,
      warnings: d.warnings,
      sectionMassKg: section.massKg,
      sectionMassSource: section.massSource,
    }),
  };
  const content = {
    section_id: section.id,
    description: `Section ${section.code}${section.name ? ` — ${section.name}` : ''} (${section.massSource})`,
    quantity: 1,
    mass_kg: section.massKg,
    cog_mm: JSON.stringify(add(section.cogMm, d.sectionOffsetMm)),
  };
  return { columns, content, design: d };
}

/** Crate columns of a stock case or pallet: from the catalogue, the planner's figures taking precedence. */
export function stockColumns(b: CreateCrateBody) {
  const s = b.stockId ? stockItem(b.stockId) : undefined;
  if (s && (s.kind === 'pallet') !== (b.kind === 'pallet')) {
    throw invalid(`"${s.name}" is a ${s.kind}, not a ${b.kind === 'pallet' ? 'pallet' : 'stock case'}.`, [{ path: 'stockId', message: `Pick a ${b.kind === 'pallet' ? 'pallet' : 'case or box'}.` }]);
  }
  const outer = (b.outerMm ?? s?.outerMm) as Vec3 | undefined;
  if (!outer) throw notFound('The outer size');
  const inner = b.innerMm === undefined ? (s?.innerMm ?? null) : b.innerMm;
  const tare = b.tareKg ?? s!.tareKg;
  // A pallet's catalogue figure is its safe working load on top; the crate's maximum gross adds its tare.
  const catalogueMax = s?.maxLoadKg === undefined ? null : s.kind === 'pallet' ? s.maxLoadKg + s.tareKg : s.maxLoadKg;
  // Tare CoG: a case's shell about its middle; a pallet's deck about half the pallet's own height [PRACTICE].
  const tareCog: Vec3 = b.kind === 'pallet' ? [outer[0] / 2, outer[1] / 2, (s?.outerMm[2] ?? 144) / 2] : [outer[0] / 2, outer[1] / 2, outer[2] / 2];
  return {
    inner_length_mm: inner?.[0] ?? null,
    inner_width_mm: inner?.[1] ?? null,
    inner_height_mm: inner?.[2] ?? null,
    outer_length_mm: outer[0],
    outer_width_mm: outer[1],
    outer_height_mm: outer[2],
    tare_kg: tare,
    max_gross_kg: b.maxGrossKg === undefined ? catalogueMax : b.maxGrossKg,
    stackable: b.stackable ?? s?.stackable ?? true,
    // Pallets (solid timber, EN 13698-1) need the mark abroad; plywood cases and cartons do not (ISPM 15).
    ispm15_required: b.ispm15Required ?? b.kind === 'pallet',
    design: JSON.stringify({ stockId: s?.id, stockName: s?.name, source: s?.source, tareCogMm: tareCog, warnings: [] }),
  };
}
