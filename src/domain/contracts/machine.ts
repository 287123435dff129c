import { z } from 'zod';
import { box3Mm, inertiaTensorKgMm2, loadCellReadings, massSource, partInstance, vec3Mm } from './mass.ts';

/**
 * Requests and responses of the machine breakdown API (`/api/productions/:productionId/machine`), shared by
 * the client's forms and the server's validation. Frame: right-handed, z up, mm, kg; units in the names.
 * The mass-properties inputs themselves are in ./mass.ts (the core's shapes).
 */

const version = z.number().int().nonnegative();
const text = (max: number) => z.string().trim().max(max);
const code = z.string().trim().min(1, 'Enter a code.').max(40, 'Use at most 40 characters.');

export const makeOrBuy = z.enum(['made', 'bought']);
export type MakeOrBuy = z.infer<typeof makeOrBuy>;

// ---------------------------------------------------------------------------------------------- views

export const machineView = z.object({
  id: z.string(),
  name: z.string(),
  /** Contingency margin, % of nominal mass, for sections that name none. */
  marginPercent: z.number(),
  version: z.number().int(),
  updatedAt: z.string(),
});
export type MachineView = z.infer<typeof machineView>;

export const sectionView = z.object({
  id: z.string(),
  code: z.string(),
  name: z.string(),
  /** Null: the machine's margin applies. */
  marginPercent: z.number().nullable(),
  cogUncertaintyMm: z.number().nullable(),
  sortOrder: z.number().int(),
  version: z.number().int(),
});
export type SectionView = z.infer<typeof sectionView>;

export const assemblyView = z.object({
  id: z.string(),
  number: z.string(),
  name: z.string(),
  parentId: z.string().nullable(),
  sectionId: z.string().nullable(),
  keepTogether: z.boolean(),
  notes: z.string(),
  version: z.number().int(),
});
export type AssemblyView = z.infer<typeof assemblyView>;

export const partLineView = z.object({
  id: z.string(),
  assemblyId: z.string().nullable(),
  sectionId: z.string().nullable(),
  partNumber: z.string(),
  name: z.string(),
  quantity: z.number(),
  unitMassKg: z.number().nullable(),
  massSource: massSource.nullable(),
  material: z.string().nullable(),
  makeOrBuy: makeOrBuy.nullable(),
  value: z.number().nullable(),
  currency: z.string().nullable(),
  countryOfOrigin: z.string().nullable(),
  serialNumbers: z.array(z.string()),
  cogMm: vec3Mm.nullable(),
  bboxMm: box3Mm.nullable(),
  inertiaKgMm2: inertiaTensorKgMm2.nullable(),
  instances: z.array(partInstance),
  notes: z.string(),
  hasMesh: z.boolean(),
  version: z.number().int(),
});
export type PartLineView = z.infer<typeof partLineView>;

/** A part line in the paged breakdown: with its effective section and its assembly's path of numbers. */
export const breakdownLineView = partLineView.extend({
  /** Its own section, else its nearest assembly's (the mass core's rule). */
  effectiveSectionId: z.string().nullable(),
  /** Assembly numbers from the root down to the line's assembly; empty for a line under the machine. */
  assemblyPath: z.array(z.string()),
});
export type BreakdownLineView = z.infer<typeof breakdownLineView>;

export const breakdownPageView = z.object({
  /** Every assembly of the machine (a few hundred at most), for the tree. */
  assemblies: z.array(assemblyView),
  lines: z.array(breakdownLineView),
  total: z.number().int(),
  offset: z.number().int(),
});
export type BreakdownPageView = z.infer<typeof breakdownPageView>;

export const addOnView = z.object({
  id: z.string(),
  sectionId: z.string(),
  name: z.string(),
  massKg: z.number().nullable(),
  massSource: massSource.nullable(),
  cogMm: vec3Mm.nullable(),
  bboxMm: box3Mm.nullable(),
  notes: z.string(),
  version: z.number().int(),
});
export type AddOnView = z.infer<typeof addOnView>;

export const materialView = z.object({
  id: z.string(),
  code: z.string(),
  name: z.string(),
  densityKgPerM3: z.number(),
  source: z.string(),
  version: z.number().int(),
});
export type MaterialView = z.infer<typeof materialView>;

export const weighingView = z.object({
  id: z.string(),
  sectionId: z.string(),
  weighedOn: z.string(),
  weighedBy: z.string(),
  scale: z.string(),
  readings: loadCellReadings,
  /** Derived by statics from the readings. */
  massKg: z.number(),
  cogPlanMm: z.tuple([z.number(), z.number()]).nullable(),
  derivedNotes: z.array(z.string()),
  notes: z.string(),
  version: z.number().int(),
  createdAt: z.string(),
});
export type WeighingView = z.infer<typeof weighingView>;

export const meshView = z.object({
  id: z.string(),
  partLineId: z.string(),
  fileName: z.string(),
  lengthUnit: z.enum(['mm', 'cm', 'm', 'in']),
  sizeBytes: z.number(),
  triangleCount: z.number(),
  volumeMm3: z.number(),
  material: z.string().nullable(),
  densityKgPerM3: z.number().nullable(),
  massKg: z.number().nullable(),
  cogMm: vec3Mm,
  bboxMm: box3Mm,
  flipped: z.boolean(),
});
export type MeshView = z.infer<typeof meshView>;

// ---------------------------------------------------------------------------------------------- bodies

export const updateMachineBody = z.object({
  version,
  name: text(120).optional(),
  marginPercent: z.number().min(0).max(1000).optional(),
});
export type UpdateMachineBody = z.infer<typeof updateMachineBody>;

const sectionFields = z.object({
  code,
  name: text(120).optional(),
  marginPercent: z.number().min(0).max(1000).nullable().optional(),
  cogUncertaintyMm: z.number().min(0).max(100_000).nullable().optional(),
  sortOrder: z.number().int().optional(),
});
export const createSectionBody = sectionFields;
export const updateSectionBody = sectionFields.partial().extend({ version });
export type CreateSectionBody = z.infer<typeof createSectionBody>;
export type UpdateSectionBody = z.infer<typeof updateSectionBody>;

const assemblyFields = z.object({
  number: code,
  name: text(200).optional(),
  parentId: z.string().uuid().nullable().optional(),
  sectionId: z.string().uuid().nullable().optional(),
  keepTogether: z.boolean().optional(),
  notes: text(2000).optional(),
});
export const createAssemblyBody = assemblyFields;
export const updateAssemblyBody = assemblyFields.partial().extend({ version });
export type CreateAssemblyBody = z.infer<typeof createAssemblyBody>;
export type UpdateAssemblyBody = z.infer<typeof updateAssemblyBody>;

const partLineFields = z.object({
  partNumber: z.string().trim().min(1, 'Enter a part number.').max(80),
  name: text(200).optional(),
  assemblyId: z.string().uuid().nullable().optional(),
  sectionId: z.string().uuid().nullable().optional(),
  quantity: z.number().nonnegative().max(1_000_000).optional(),
  unitMassKg: z.number().nonnegative().max(1_000_000).nullable().optional(),
  massSource: massSource.nullable().optional(),
  material: text(80).nullable().optional(),
  makeOrBuy: makeOrBuy.nullable().optional(),
  value: z.number().nonnegative().nullable().optional(),
  currency: z.string().trim().regex(/^[A-Z]{3}$/, 'Use a three-letter currency code, e.g. EUR.').nullable().optional(),
  countryOfOrigin: z.string().trim().regex(/^[A-Z]{2}$/, 'Use a two-letter country code, e.g. NL.').nullable().optional(),
  serialNumbers: z.array(text(80)).max(10_000).optional(),
  cogMm: vec3Mm.nullable().optional(),
  bboxMm: box3Mm.nullable().optional(),
  instances: z.array(partInstance).max(10_000).optional(),
  notes: text(2000).optional(),
});
export const createPartLineBody = partLineFields;
export const updatePartLineBody = partLineFields.partial().extend({ version });
export type CreatePartLineBody = z.infer<typeof createPartLineBody>;
export type UpdatePartLineBody = z.infer<typeof updatePartLineBody>;

const addOnFields = z.object({
  name: z.string().trim().min(1, 'Enter a name.').max(120),
  massKg: z.number().nonnegative().max(1_000_000).nullable().optional(),
  massSource: massSource.nullable().optional(),
  cogMm: vec3Mm.nullable().optional(),
  bboxMm: box3Mm.nullable().optional(),
  notes: text(2000).optional(),
});
export const createAddOnBody = addOnFields;
export const updateAddOnBody = addOnFields.partial().extend({ version });
export type CreateAddOnBody = z.infer<typeof createAddOnBody>;
export type UpdateAddOnBody = z.infer<typeof updateAddOnBody>;

const materialFields = z.object({
  code: z.string().trim().toLowerCase().regex(/^[a-z0-9][a-z0-9-]{0,39}$/, 'Use lower-case letters, digits and dashes (at most 40).'),
  name: z.string().trim().min(1, 'Enter a name.').max(120),
  densityKgPerM3: z.number().positive('Density must be above zero.').max(30_000),
  source: text(300).optional(),
});
export const createMaterialBody = materialFields;
export const updateMaterialBody = materialFields.partial().extend({ version });
export type CreateMaterialBody = z.infer<typeof createMaterialBody>;
export type UpdateMaterialBody = z.infer<typeof updateMaterialBody>;

/** Moves assemblies and part lines into a section (or out of every section: null), all or nothing. */
export const moveBody = z
  .object({
    sectionId: z.string().uuid().nullable(),
    assemblies: z.array(z.object({ id: z.string().uuid(), version })).max(10_000).default([]),
    lines: z.array(z.object({ id: z.string().uuid(), version })).max(100_000).default([]),
  })
  .refine((b) => b.assemblies.length + b.lines.length > 0, { message: 'Choose at least one assembly or part line to move.', path: ['assemblies'] });
export type MoveBody = z.infer<typeof moveBody>;

export const recordWeighingBody = z.object({
  weighedOn: z.iso.date('Use a date like 2027-03-14.'),
  weighedBy: z.string().trim().min(1, 'Say who weighed it.').max(120),
  scale: text(200).optional(),
  readings: loadCellReadings,
  notes: text(2000).optional(),
});
export type RecordWeighingBody = z.infer<typeof recordWeighingBody>;

/** Query of the paged breakdown: filters run on the server so 5,000+ lines never travel at once. */
export const breakdownQuery = z.object({
  offset: z.coerce.number().int().min(0).default(0),
  limit: z.coerce.number().int().min(1).max(20_000).default(500),
  q: z.string().trim().max(120).optional(),
  sectionId: z.union([z.string().uuid(), z.literal('none')]).optional(),
  assemblyId: z.string().uuid().optional(),
  massSource: z.union([massSource, z.literal('none')]).optional(),
  gaps: z.enum(['true', 'false']).optional(),
  /** 'tree': depth-first by assembly number, each assembly's lines together. */
  sort: z.enum(['tree', 'partNumber', 'name', 'quantity', 'unitMassKg', 'lineMassKg', 'massSource', 'material']).default('tree'),
  dir: z.enum(['asc', 'desc']).default('asc'),
});
export type BreakdownQuery = z.infer<typeof breakdownQuery>;

export const stlUnit = z.enum(['mm', 'cm', 'm', 'in']);
/** Form fields sent with an STL upload (multipart). */
export const meshUploadFields = z.object({
  unit: stlUnit,
  /** Material code for the CAD mass; absent: the line's own material. */
  material: z.string().trim().max(80).optional(),
});

export const exportQuery = z.object({ format: z.enum(['csv', 'xlsx']).default('csv') });

// ---------------------------------------------------------------------------------------------- mass properties

/** A box as sent back (already checked by the core, so no refinement here). */
const boxView = z.object({ minMm: vec3Mm, maxMm: vec3Mm });

export const massConfidenceView = z.object({
  weighedKg: z.number(),
  catalogueKg: z.number(),
  cadKg: z.number(),
  estimatedKg: z.number(),
  weighedOrCatalogueKg: z.number(),
  weighedOrCataloguePercent: z.number(),
  cadPercent: z.number(),
  estimatedPercent: z.number(),
});

export const massGapView = z.object({
  lineId: z.string(),
  label: z.string(),
  kind: z.enum(['line', 'addOn']),
  assemblyId: z.string().nullable(),
  sectionId: z.string().nullable(),
  reasons: z.array(z.string()),
});
export type MassGapView = z.infer<typeof massGapView>;

/** The core's NodeMassProperties as the API sends it. */
export const nodeMassView = z.object({
  id: z.string(),
  kind: z.enum(['assembly', 'section', 'loose', 'machine', 'total']),
  massKg: z.number(),
  massWithMarginKg: z.number(),
  cogMm: vec3Mm.nullable(),
  bboxMm: boxView.nullable(),
  inertiaKgMm2: inertiaTensorKgMm2.nullable(),
  confidence: massConfidenceView,
  lineCount: z.number(),
  unitCount: z.number(),
  addOnCount: z.number(),
  gaps: z.array(massGapView),
  complete: z.boolean(),
  approximateLineCount: z.number(),
  approximateMassKg: z.number(),
  assumedInertiaLineCount: z.number(),
  pointMassLineCount: z.number(),
});
export type NodeMassView = z.infer<typeof nodeMassView>;

export const weighingComparisonView = z.object({
  differenceKg: z.number(),
  differencePercent: z.number(),
  cogOffsetMm: z.object({ dx: z.number(), dy: z.number(), distance: z.number() }).nullable(),
  massDifferenceLarge: z.boolean(),
  cogOffsetLarge: z.boolean(),
  large: z.boolean(),
  notes: z.array(z.string()),
});
export type WeighingComparisonView = z.infer<typeof weighingComparisonView>;

export const sectionMassView = nodeMassView.extend({
  /** The margin that applies: the section's own, else the machine's, %. */
  marginPercent: z.number(),
  /** The latest weighing (it governs) with its comparison to the computed figures. */
  weighing: weighingView.extend({ comparison: weighingComparisonView.nullable() }).nullable(),
});
export type SectionMassView = z.infer<typeof sectionMassView>;

export const machineMassView = z.object({
  marginPercent: z.number(),
  sections: z.record(z.string(), sectionMassView),
  assemblies: z.record(z.string(), nodeMassView),
  loose: nodeMassView,
  machine: nodeMassView,
  total: nodeMassView,
  gaps: z.array(massGapView),
  warnings: z.array(z.object({ id: z.string(), message: z.string() })),
});
export type MachineMassView = z.infer<typeof machineMassView>;

export const machineSummaryView = z.object({
  machine: machineView,
  sections: z.array(sectionView),
  addOns: z.array(addOnView),
  materials: z.array(materialView),
  lineCount: z.number(),
  assemblyCount: z.number(),
});
export type MachineSummaryView = z.infer<typeof machineSummaryView>;
