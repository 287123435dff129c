import type { Request } from 'express';
import { meshUploadFields } from '../../../src/domain/contracts/machine.ts';
import { findMaterial, meshMassProperties, parseStl, type MeshMassProperties, type ParsedStl } from '../../../src/domain/mass/index.ts';
import { can, route, uuidParam, type RouteDef } from '../../http/routes.ts';
import { AppError, notFound } from '../../http/errors.ts';
import type { AppDeps } from '../../app.ts';
import { json, toMeshView, toMaterialView, toPartLineView, type MaterialRow, type MeshRow, type PartLineRow } from './machine.repository.ts';
import { requireFile, singleUpload, type UploadRule } from './upload.ts';
import type { z } from 'zod';

/** 1,000,000 binary triangles are 50 MB; a little room above that. */
export const MESH_MAX_BYTES = 64 * 1024 * 1024;
export const MESH_UPLOAD: UploadRule = { field: 'file', maxBytes: MESH_MAX_BYTES, extensions: ['.stl'], label: 'an STL file (.stl)' };

/**
 * STL meshes of made parts. The core reads the file (binary or ASCII, in the unit chosen on upload since STL
 * has none), refuses a mesh that is not closed with its reason, turns a consistently inside-out mesh right
 * side out, and computes volume, CoG, box and inertia by the divergence theorem; the mass follows from the
 * material's density. The part line then takes the mesh's CoG, box and inertia, and its mass as CAD unless
 * it already has a firmer one (weighed or catalogue).
 */
export function meshRoutes(deps: AppDeps): RouteDef[] {
  const { db } = deps;
  const lineOf = async (req: Request) => {
    const productionId = uuidParam(req, 'productionId');
    const id = uuidParam(req, 'lineId');
    const line = await db<PartLineRow>('machine_part_lines').where({ id, production_id: productionId }).first();
    if (!line) throw notFound('The part line');
    return { productionId, line };
  };
  return [
    route({
      method: 'post',
      path: '/lines/:lineId/mesh',
      access: can('machine.edit'),
      before: [singleUpload(MESH_UPLOAD)],
      body: meshUploadFields,
      async handler(req, res) {
        const { productionId, line } = await lineOf(req);
        const file = requireFile(req.file, MESH_UPLOAD);
        const fields = req.body as z.infer<typeof meshUploadFields>;
        const bytes = new Uint8Array(file.buffer.buffer, file.buffer.byteOffset, file.buffer.byteLength);

        let parsed: ParsedStl;
        try {
          parsed = parseStl(bytes, fields.unit, { fileName: file.originalname });
        } catch (e) {
          throw new AppError('invalid', (e as Error).message, { code: 'stl_unreadable', issues: [{ path: 'file', message: (e as Error).message }] });
        }

        const materialCode = fields.material || line.material || null;
        const materials = (await db<MaterialRow>('machine_materials').where({ production_id: productionId })).map(toMaterialView);
        const material = materialCode ? findMaterial(materials, materialCode) : undefined;
        if (materialCode && !material) {
          const message = `Material "${materialCode}" is not in this production's materials; add it or pick one of: ${materials.map((m) => m.code).join(', ')}.`;
          throw new AppError('invalid', message, { issues: [{ path: 'material', message }] });
        }
        let props: MeshMassProperties;
        try {
          // Without a material the geometry still counts (CoG, box); mass and inertia then stay unknown.
          props = meshMassProperties(parsed.trianglesMm, material?.densityKgPerM3 ?? 1000, { itemName: file.originalname });
        } catch (e) {
          const message = (e as Error).message;
          const notClosed = /not closed/.test(message);
          throw new AppError('invalid', message, { code: notClosed ? 'mesh_not_closed' : 'mesh_invalid', issues: [{ path: 'file', message }] });
        }
        const massKg = material ? props.massKg : null;
        const bbox = props.bboxMm ?? null;

        const out = await db.transaction(async (trx) => {
          await trx('machine_meshes').where({ part_line_id: line.id, production_id: productionId }).delete();
          const [mesh] = await trx('machine_meshes')
            .insert({
              production_id: productionId,
              part_line_id: line.id,
              file_name: file.originalname,
              length_unit: fields.unit,
              stl: file.buffer,
              size_bytes: file.size,
              triangle_count: parsed.triangleCount,
              volume_mm3: props.volumeMm3,
              material: material?.code ?? null,
              density_kg_per_m3: material?.densityKgPerM3 ?? null,
              mass_kg: massKg,
              cog_mm: json(props.cogMm),
              bbox_mm: json(bbox),
              inertia_kg_mm2: json(material ? props.inertiaKgMm2 : null),
              flipped: Boolean(props.flipped),
              uploaded_by: req.actor!.userId,
            })
            .returning('*');
          const firmer = line.mass_source === 'weighed' || line.mass_source === 'catalogue';
          const changes: Record<string, unknown> = { cog_mm: json(props.cogMm), bbox_mm: json(bbox), version: db.raw('version + 1'), updated_at: db.fn.now() };
          if (material) changes.material = material.code;
          if (material && !firmer) {
            changes.unit_mass_kg = massKg;
            changes.mass_source = 'cad';
            changes.inertia_kg_mm2 = json(props.inertiaKgMm2);
          }
          const [updated] = await trx('machine_part_lines').where({ id: line.id, production_id: productionId }).update(changes).returning('*');
          return { mesh: mesh as MeshRow, line: updated as PartLineRow, keptMass: Boolean(material && firmer) };
        });
        const notes: string[] = [];
        if (props.flipped) notes.push('The mesh was inside out (faces clockwise seen from outside); it was turned right side out.');
        if (!material) notes.push('No material: volume, CoG and box are set; mass and inertia need a material.');
        if (out.keptMass) notes.push(`The line keeps its ${line.mass_source} mass; the mesh's CAD mass (${massKg?.toFixed(3)} kg) is shown for comparison.`);
        res.status(201).json({ mesh: toMeshView(out.mesh), line: toPartLineView(out.line, [], true), notes });
      },
    }),
    route({
      method: 'get',
      path: '/lines/:lineId/mesh',
      access: can('machine.read'),
      async handler(req) {
        const { productionId, line } = await lineOf(req);
        const mesh = await db<MeshRow>('machine_meshes')
          .where({ part_line_id: line.id, production_id: productionId })
          .first('id', 'production_id', 'part_line_id', 'file_name', 'length_unit', 'size_bytes', 'triangle_count', 'volume_mm3', 'material', 'density_kg_per_m3', 'mass_kg', 'cog_mm', 'bbox_mm', 'flipped');
        if (!mesh) throw notFound('The mesh of this part line');
        return { mesh: toMeshView(mesh) };
      },
    }),
    route({
      method: 'get',
      path: '/lines/:lineId/mesh/stl',
      access: can('machine.read'),
      async handler(req, res) {
        const { productionId, line } = await lineOf(req);
        const mesh = await db('machine_meshes').where({ part_line_id: line.id, production_id: productionId }).first('stl', 'file_name', 'length_unit');
        if (!mesh) throw notFound('The mesh of this part line');
        res.setHeader('Content-Type', 'model/stl');
        res.setHeader('X-Length-Unit', mesh.length_unit);
        res.setHeader('Content-Disposition', `attachment; filename="${String(mesh.file_name).replace(/[^\w.-]/g, '_')}"`);
        res.send(mesh.stl);
      },
    }),
    route({
      method: 'delete',
      path: '/lines/:lineId/mesh',
      access: can('machine.edit'),
      async handler(req) {
        const { productionId, line } = await lineOf(req);
        const n = await db('machine_meshes').where({ part_line_id: line.id, production_id: productionId }).delete();
        if (!n) throw notFound('The mesh of this part line');
      },
    }),
  ];
}
