import { z } from 'zod';

/**
 * Shapes of the mass-properties inputs, shared by client forms, server validation and the core
 * (src/domain/mass/mass-properties.ts takes exactly these types). Frame: right-handed, z up, mm, kg.
 */

/** A position or direction, mm: [x, y, z]. */
export const vec3Mm = z.tuple([z.number(), z.number(), z.number()]);

/** Axis-aligned box, mm. Invariant min ≤ max per axis. */
export const box3Mm = z
  .object({ minMm: vec3Mm, maxMm: vec3Mm })
  .refine((b) => b.minMm.every((v, i) => v <= b.maxMm[i]), { message: 'box minimum must not exceed its maximum on any axis' });

/** Where a mass figure comes from, firmest first. CAD = volume × density. */
export const massSource = z.enum(['weighed', 'catalogue', 'cad', 'estimated']);
export type MassSource = z.infer<typeof massSource>;
export const MASS_SOURCES = massSource.options;

/** 3×3 inertia tensor, kg·mm² (off-diagonals are the negated products of inertia). */
export const inertiaTensorKgMm2 = z.array(z.array(z.number()).length(3)).length(3);

/**
 * One placed unit of a part line: the part's own frame is moved to `positionMm` and turned by Euler angles
 * Z-Y-X in degrees (R = Rz·Ry·Rx, intrinsic; see rotationFromEulerZyxDeg). world = R·local + position.
 */
export const partInstance = z.object({
  positionMm: vec3Mm,
  eulerZyxDeg: vec3Mm.optional(),
});
export type PartInstance = z.infer<typeof partInstance>;

/**
 * A part line as the mass core sees it. Without instances, `cogMm` and `bboxMm` are in the machine frame and
 * all `quantity` units sit at that one CoG (flagged approximate when quantity > 1). With instances, they are
 * in the part's own frame and each instance places one unit; `quantity` must equal the number of instances.
 * A null mass or CoG is a gap: listed, never counted as zero.
 */
export const massPartLine = z.object({
  id: z.string().min(1),
  /** For messages, e.g. the part number. */
  label: z.string().optional(),
  /** Assembly it belongs to; null = directly under the machine. */
  assemblyId: z.string().nullable(),
  /** Section it is assigned to directly; overrides its assembly's section. Null/absent = inherits. */
  sectionId: z.string().nullable().optional(),
  quantity: z.number().nonnegative(),
  /** Mass of one unit, kg; null when unknown (a gap). */
  unitMassKg: z.number().nonnegative().nullable(),
  /** Null with a mass: counted as estimated. */
  massSource: massSource.nullable(),
  /** CoG of one unit, mm; null when unknown (a gap). */
  cogMm: vec3Mm.nullable(),
  /** Bounding box of one unit, mm; used for the section's size and, without own inertia, as a solid cuboid. */
  bboxMm: box3Mm.nullable().optional(),
  instances: z.array(partInstance).optional(),
  /** Inertia of one unit about its own CoG, kg·mm², in the same frame as cogMm. */
  inertiaKgMm2: inertiaTensorKgMm2.nullable().optional(),
});
export type MassPartLine = z.infer<typeof massPartLine>;

/** A node of the assembly tree. */
export const massAssembly = z.object({
  id: z.string().min(1),
  label: z.string().optional(),
  parentId: z.string().nullable(),
  /** Section the whole subtree goes in, unless a sub-assembly or line says otherwise. */
  sectionId: z.string().nullable().optional(),
});
export type MassAssembly = z.infer<typeof massAssembly>;

/** A transportable unit. */
export const massSection = z.object({ id: z.string().min(1), label: z.string().optional() });
export type MassSection = z.infer<typeof massSection>;

/** Something that travels with a section but is not a machine part: transport frame, cradle, lifting beam. */
export const massAddOn = z.object({
  id: z.string().min(1),
  label: z.string().optional(),
  sectionId: z.string().min(1),
  massKg: z.number().nonnegative().nullable(),
  /** Absent: counted as estimated. */
  massSource: massSource.nullable().optional(),
  cogMm: vec3Mm.nullable(),
  bboxMm: box3Mm.nullable().optional(),
  inertiaKgMm2: inertiaTensorKgMm2.nullable().optional(),
});
export type MassAddOn = z.infer<typeof massAddOn>;

export const massPropertiesInput = z.object({
  lines: z.array(massPartLine),
  assemblies: z.array(massAssembly),
  sections: z.array(massSection).default([]),
  addOns: z.array(massAddOn).default([]),
  /** Contingency margin, percent of nominal mass, ≥ 0; lifting and packing use the mass with margin. */
  marginPercent: z.number().min(0).max(1000).default(0),
});
export type MassPropertiesInput = z.input<typeof massPropertiesInput>;

/** A load-cell reading (net of tare) at a support point in the section's frame. */
export const loadCellReading = z.object({
  positionMm: z.tuple([z.number(), z.number()]),
  readingKg: z.number().nonnegative(),
});
export const loadCellReadings = z.array(loadCellReading).min(1).max(16);
