import type { Request } from 'express';
import type { Knex } from 'knex';
import {
  breakdownQuery,
  createAddOnBody,
  createAssemblyBody,
  createMaterialBody,
  createPartLineBody,
  createSectionBody,
  moveBody,
  updateAddOnBody,
  updateAssemblyBody,
  updateMachineBody,
  updateMaterialBody,
  updatePartLineBody,
  updateSectionBody,
  type BreakdownQuery,
  type CreateAddOnBody,
  type CreateAssemblyBody,
  type CreateMaterialBody,
  type CreatePartLineBody,
  type CreateSectionBody,
  type MoveBody,
  type UpdateAddOnBody,
  type UpdateAssemblyBody,
  type UpdateMachineBody,
  type UpdateMaterialBody,
  type UpdatePartLineBody,
  type UpdateSectionBody,
} from '../../../src/domain/contracts/machine.ts';
import { can, route, uuidParam, type RouteDef } from '../../http/routes.ts';
import { AppError, invalid, notFound, type FieldIssue } from '../../http/errors.ts';
import { updateVersioned } from '../../http/versioned.ts';
import type { AppDeps } from '../../app.ts';
import {
  ensureMachine,
  instanceRows,
  instancesByLine,
  json,
  partLineColumns,
  toAddOnView,
  toAssemblyView,
  toMachineView,
  toMaterialView,
  toPartLineView,
  toSectionView,
  type AddOnRow,
  type AssemblyRow,
  type MachineRow,
  type MaterialRow,
  type PartLineRow,
  type SectionRow,
} from './machine.repository.ts';
import { breakdownPageJson } from './breakdown.query.ts';
import { loadMassInput, machineMass } from './mass.service.ts';
import { weighingRoutes } from './weighing.routes.ts';
import { meshRoutes } from './mesh.routes.ts';
import { importRoutes } from './import.routes.ts';

/**
 * The machine breakdown of one production, under `/api/productions/:productionId/machine`. Every query is
 * scoped by the production in the path; every save of an existing row goes through updateVersioned (409
 * with the current record when stale); multi-row writes run in one transaction.
 */
export function machineRoutes(deps: AppDeps): RouteDef[] {
  const { db } = deps;
  const pid = (req: Request) => uuidParam(req, 'productionId');

  return [
    // ----------------------------------------------------------------------------------- machine
    route({
      method: 'get',
      path: '/',
      access: can('machine.read'),
      async handler(req) {
        const productionId = pid(req);
        const production = await db('productions').where({ id: productionId }).first('machine_name');
        const machine = await ensureMachine(db, productionId, production?.machine_name ?? '');
        const [sections, addOns, materials, counts] = await Promise.all([
          db<SectionRow>('machine_sections').where({ production_id: productionId }).orderBy(['sort_order', 'code']),
          db<AddOnRow>('machine_section_add_ons').where({ production_id: productionId }).orderBy('name'),
          db<MaterialRow>('machine_materials').where({ production_id: productionId }).orderBy('name'),
          db.raw(
            `select (select count(*) from machine_part_lines where production_id = ?) as lines,
                    (select count(*) from machine_assemblies where production_id = ?) as assemblies`,
            [productionId, productionId],
          ),
        ]);
        const c = (counts as { rows: { lines: number; assemblies: number }[] }).rows[0];
        return {
          machine: toMachineView(machine),
          sections: sections.map(toSectionView),
          addOns: addOns.map(toAddOnView),
          materials: materials.map(toMaterialView),
          lineCount: Number(c.lines),
          assemblyCount: Number(c.assemblies),
        };
      },
    }),
    route({
      method: 'patch',
      path: '/',
      access: can('machine.edit'),
      body: updateMachineBody,
      async handler(req) {
        const productionId = pid(req);
        const b = req.body as UpdateMachineBody;
        await ensureMachine(db, productionId);
        const changes: Record<string, unknown> = {};
        if (b.name !== undefined) changes.name = b.name;
        if (b.marginPercent !== undefined) changes.margin_percent = b.marginPercent;
        const row = await updateVersioned<MachineRow>(db, 'machines', { production_id: productionId }, b.version, changes, 'The machine', toMachineView);
        return { machine: toMachineView(row) };
      },
    }),

    // ----------------------------------------------------------------------------------- mass properties
    route({
      method: 'get',
      path: '/mass-properties',
      access: can('machine.read'),
      handler: async (req) => ({ massProperties: await machineMass(db, pid(req)) }),
    }),
    route({
      method: 'get',
      path: '/mass-input',
      access: can('machine.read'),
      async handler(req) {
        const { sectionMargins, ...input } = await loadMassInput(db, pid(req));
        return { input, sectionMargins };
      },
    }),

    // ----------------------------------------------------------------------------------- breakdown
    route({
      method: 'get',
      path: '/breakdown',
      access: can('machine.read'),
      query: breakdownQuery,
      async handler(req) {
        const productionId = pid(req);
        const q = req.query as unknown as BreakdownQuery;
        const [, page] = await Promise.all([ensureMachine(db, productionId), breakdownPageJson(db, productionId, q)]);
        return page;
      },
    }),

    // ----------------------------------------------------------------------------------- sections
    route({
      method: 'post',
      path: '/sections',
      access: can('machine.edit'),
      body: createSectionBody,
      async handler(req, res) {
        const productionId = pid(req);
        const machine = await ensureMachine(db, productionId);
        const b = req.body as CreateSectionBody;
        await uniqueOr409(db, 'machine_sections', { production_id: productionId, code: b.code }, `A section with code "${b.code}" already exists.`, 'code');
        const [row] = await db('machine_sections')
          .insert({
            production_id: productionId,
            machine_id: machine.id,
            code: b.code,
            name: b.name ?? '',
            margin_percent: b.marginPercent ?? null,
            cog_uncertainty_mm: b.cogUncertaintyMm ?? null,
            sort_order: b.sortOrder ?? 0,
          })
          .returning('*');
        res.status(201).json({ section: toSectionView(row) });
      },
    }),
    route({
      method: 'patch',
      path: '/sections/:sectionId',
      access: can('machine.edit'),
      body: updateSectionBody,
      async handler(req) {
        const productionId = pid(req);
        const id = uuidParam(req, 'sectionId');
        const b = req.body as UpdateSectionBody;
        if (b.code !== undefined) {
          await uniqueOr409(db, 'machine_sections', { production_id: productionId, code: b.code }, `A section with code "${b.code}" already exists.`, 'code', id);
        }
        const changes = pick(b, { code: 'code', name: 'name', marginPercent: 'margin_percent', cogUncertaintyMm: 'cog_uncertainty_mm', sortOrder: 'sort_order' });
        const row = await updateVersioned<SectionRow>(db, 'machine_sections', { id, production_id: productionId }, b.version, changes, 'The section', toSectionView);
        return { section: toSectionView(row) };
      },
    }),
    route({
      method: 'delete',
      path: '/sections/:sectionId',
      access: can('machine.edit'),
      async handler(req) {
        // Its assemblies and lines become loose (foreign keys set null); add-ons and weighings go with it.
        const n = await db('machine_sections').where({ id: uuidParam(req, 'sectionId'), production_id: pid(req) }).delete();
        if (!n) throw notFound('The section');
      },
    }),

    // ----------------------------------------------------------------------------------- add-ons
    route({
      method: 'post',
      path: '/sections/:sectionId/add-ons',
      access: can('machine.edit'),
      body: createAddOnBody,
      async handler(req, res) {
        const productionId = pid(req);
        const sectionId = uuidParam(req, 'sectionId');
        if (!(await db('machine_sections').where({ id: sectionId, production_id: productionId }).first('id'))) throw notFound('The section');
        const b = req.body as CreateAddOnBody;
        const [row] = await db('machine_section_add_ons')
          .insert({
            production_id: productionId,
            section_id: sectionId,
            name: b.name,
            mass_kg: b.massKg ?? null,
            mass_source: b.massSource ?? null,
            cog_mm: json(b.cogMm),
            bbox_mm: json(b.bboxMm),
            notes: b.notes ?? '',
          })
          .returning('*');
        res.status(201).json({ addOn: toAddOnView(row) });
      },
    }),
    route({
      method: 'patch',
      path: '/add-ons/:addOnId',
      access: can('machine.edit'),
      body: updateAddOnBody,
      async handler(req) {
        const b = req.body as UpdateAddOnBody;
        const changes = pick(b, { name: 'name', massKg: 'mass_kg', massSource: 'mass_source', notes: 'notes' });
        if (b.cogMm !== undefined) changes.cog_mm = json(b.cogMm);
        if (b.bboxMm !== undefined) changes.bbox_mm = json(b.bboxMm);
        const row = await updateVersioned<AddOnRow>(db, 'machine_section_add_ons', { id: uuidParam(req, 'addOnId'), production_id: pid(req) }, b.version, changes, 'The add-on', toAddOnView);
        return { addOn: toAddOnView(row) };
      },
    }),
    route({
      method: 'delete',
      path: '/add-ons/:addOnId',
      access: can('machine.edit'),
      async handler(req) {
        const n = await db('machine_section_add_ons').where({ id: uuidParam(req, 'addOnId'), production_id: pid(req) }).delete();
        if (!n) throw notFound('The add-on');
      },
    }),

    // ----------------------------------------------------------------------------------- materials
    route({
      method: 'post',
      path: '/materials',
      access: can('machine.edit'),
      body: createMaterialBody,
      async handler(req, res) {
        const productionId = pid(req);
        await ensureMachine(db, productionId);
        const b = req.body as CreateMaterialBody;
        await uniqueOr409(db, 'machine_materials', { production_id: productionId, code: b.code }, `A material with code "${b.code}" already exists.`, 'code');
        const [row] = await db('machine_materials')
          .insert({ production_id: productionId, code: b.code, name: b.name, density_kg_per_m3: b.densityKgPerM3, source: b.source ?? '' })
          .returning('*');
        res.status(201).json({ material: toMaterialView(row) });
      },
    }),
    route({
      method: 'patch',
      path: '/materials/:materialId',
      access: can('machine.edit'),
      body: updateMaterialBody,
      async handler(req) {
        const productionId = pid(req);
        const id = uuidParam(req, 'materialId');
        const b = req.body as UpdateMaterialBody;
        if (b.code !== undefined) {
          await uniqueOr409(db, 'machine_materials', { production_id: productionId, code: b.code }, `A material with code "${b.code}" already exists.`, 'code', id);
        }
        const changes = pick(b, { code: 'code', name: 'name', densityKgPerM3: 'density_kg_per_m3', source: 'source' });
        const row = await updateVersioned<MaterialRow>(db, 'machine_materials', { id, production_id: productionId }, b.version, changes, 'The material', toMaterialView);
        return { material: toMaterialView(row) };
      },
    }),
    route({
      method: 'delete',
      path: '/materials/:materialId',
      access: can('machine.edit'),
      async handler(req) {
        const n = await db('machine_materials').where({ id: uuidParam(req, 'materialId'), production_id: pid(req) }).delete();
        if (!n) throw notFound('The material');
      },
    }),

    // ----------------------------------------------------------------------------------- assemblies
    route({
      method: 'post',
      path: '/assemblies',
      access: can('machine.edit'),
      body: createAssemblyBody,
      async handler(req, res) {
        const productionId = pid(req);
        const machine = await ensureMachine(db, productionId);
        const b = req.body as CreateAssemblyBody;
        await uniqueOr409(db, 'machine_assemblies', { production_id: productionId, number: b.number }, `An assembly numbered "${b.number}" already exists.`, 'number');
        await checkRefs(db, productionId, { parentId: b.parentId, sectionId: b.sectionId });
        const [row] = await db('machine_assemblies')
          .insert({
            production_id: productionId,
            machine_id: machine.id,
            number: b.number,
            name: b.name ?? '',
            parent_id: b.parentId ?? null,
            section_id: b.sectionId ?? null,
            keep_together: b.keepTogether ?? false,
            notes: b.notes ?? '',
          })
          .returning('*');
        res.status(201).json({ assembly: toAssemblyView(row) });
      },
    }),
    route({
      method: 'patch',
      path: '/assemblies/:assemblyId',
      access: can('machine.edit'),
      body: updateAssemblyBody,
      async handler(req) {
        const productionId = pid(req);
        const id = uuidParam(req, 'assemblyId');
        const b = req.body as UpdateAssemblyBody;
        if (b.number !== undefined) {
          await uniqueOr409(db, 'machine_assemblies', { production_id: productionId, number: b.number }, `An assembly numbered "${b.number}" already exists.`, 'number', id);
        }
        await checkRefs(db, productionId, { parentId: b.parentId, sectionId: b.sectionId });
        if (b.parentId) await refuseCycle(db, productionId, id, b.parentId);
        const changes = pick(b, { number: 'number', name: 'name', parentId: 'parent_id', sectionId: 'section_id', keepTogether: 'keep_together', notes: 'notes' });
        const row = await updateVersioned<AssemblyRow>(db, 'machine_assemblies', { id, production_id: productionId }, b.version, changes, 'The assembly', toAssemblyView);
        return { assembly: toAssemblyView(row) };
      },
    }),
    route({
      method: 'delete',
      path: '/assemblies/:assemblyId',
      access: can('machine.edit'),
      async handler(req) {
        const productionId = pid(req);
        const id = uuidParam(req, 'assemblyId');
        const row = await db('machine_assemblies').where({ id, production_id: productionId }).first('id', 'number');
        if (!row) throw notFound('The assembly');
        const { rows } = (await db.raw(
          `with recursive t(id) as (select ?::uuid union all select c.id from machine_assemblies c join t on c.parent_id = t.id)
           select (select count(*) from t) - 1 as subs, (select count(*) from machine_part_lines where assembly_id in (select id from t)) as lines`,
          [id],
        )) as { rows: { subs: number; lines: number }[] };
        const { subs, lines } = rows[0];
        if ((subs > 0 || lines > 0) && req.query.withContents !== 'true') {
          throw new AppError('conflict', `Assembly ${row.number} holds ${subs} sub-assemblies and ${lines} part lines: delete them with it, or move them first.`);
        }
        await db('machine_assemblies').where({ id, production_id: productionId }).delete();
      },
    }),

    // ----------------------------------------------------------------------------------- part lines
    route({
      method: 'post',
      path: '/lines',
      access: can('machine.edit'),
      body: createPartLineBody,
      async handler(req, res) {
        const productionId = pid(req);
        const machine = await ensureMachine(db, productionId);
        const b = req.body as CreatePartLineBody;
        await checkRefs(db, productionId, { assemblyId: b.assemblyId, sectionId: b.sectionId });
        const instances = b.instances ?? [];
        const quantity = instanceQuantity(b.quantity, instances);
        const row = await db.transaction(async (trx) => {
          const [{ next }] = (await trx('machine_part_lines').where({ production_id: productionId }).max('sort_order as next')) as { next: number | null }[];
          const [line] = await trx('machine_part_lines')
            .insert({ ...partLineColumns({ ...b, quantity }), production_id: productionId, machine_id: machine.id, sort_order: (next ?? 0) + 1 })
            .returning('*');
          if (instances.length) await trx('machine_part_instances').insert(instanceRows(productionId, line.id, instances));
          return line as PartLineRow;
        });
        res.status(201).json({ line: toPartLineView(row, instances) });
      },
    }),
    route({
      method: 'get',
      path: '/lines/:lineId',
      access: can('machine.read'),
      async handler(req) {
        const productionId = pid(req);
        const id = uuidParam(req, 'lineId');
        const row = await db<PartLineRow>('machine_part_lines').where({ id, production_id: productionId }).first();
        if (!row) throw notFound('The part line');
        const [instances, mesh] = await Promise.all([instancesByLine(db, productionId, [id]), db('machine_meshes').where({ part_line_id: id }).first('id')]);
        return { line: toPartLineView(row, instances.get(id) ?? [], Boolean(mesh)) };
      },
    }),
    route({
      method: 'patch',
      path: '/lines/:lineId',
      access: can('machine.edit'),
      body: updatePartLineBody,
      async handler(req) {
        const productionId = pid(req);
        const id = uuidParam(req, 'lineId');
        const b = req.body as UpdatePartLineBody;
        await checkRefs(db, productionId, { assemblyId: b.assemblyId, sectionId: b.sectionId });
        const present = async (r: PartLineRow) => toPartLineView(r, (await instancesByLine(db, productionId, [id])).get(id) ?? []);
        const save = async (trx: Knex) => {
          const changes = partLineColumns(b);
          if (b.instances !== undefined) {
            if (b.instances.length > 0) changes.quantity = instanceQuantity(b.quantity, b.instances);
            await trx('machine_part_instances').where({ part_line_id: id, production_id: productionId }).delete();
          }
          const updated = await updateVersioned<PartLineRow>(trx, 'machine_part_lines', { id, production_id: productionId }, b.version, changes, 'The part line', (r) => r);
          if (b.instances?.length) await trx('machine_part_instances').insert(instanceRows(productionId, id, b.instances));
          return updated;
        };
        // New instances replace the old ones in one transaction; a save of the line alone is one UPDATE,
        // atomic by itself (a transaction around it only added two round trips to every save).
        const row = await (b.instances !== undefined ? db.transaction(save) : save(db)).catch(async (e: unknown) => {
          // The 409 carries the current record in its API shape (with instances).
          if (e instanceof AppError && e.kind === 'conflict' && e.details.current) throw new AppError('conflict', e.message, { current: await present(e.details.current as PartLineRow) });
          throw e;
        });
        const [instances, mesh] = await Promise.all([instancesByLine(db, productionId, [id]), db('machine_meshes').where({ part_line_id: id }).first('id')]);
        return { line: toPartLineView(row, instances.get(id) ?? [], Boolean(mesh)) };
      },
    }),
    route({
      method: 'delete',
      path: '/lines/:lineId',
      access: can('machine.edit'),
      async handler(req) {
        const n = await db('machine_part_lines').where({ id: uuidParam(req, 'lineId'), production_id: pid(req) }).delete();
        if (!n) throw notFound('The part line');
      },
    }),

    // ----------------------------------------------------------------------------------- moving
    route({
      method: 'post',
      path: '/move',
      access: can('machine.edit'),
      body: moveBody,
      async handler(req) {
        const productionId = pid(req);
        const b = req.body as MoveBody;
        await checkRefs(db, productionId, { sectionId: b.sectionId });
        // One transaction: a stale row anywhere (409) or an unknown id (404) moves nothing.
        const moved = await db.transaction(async (trx) => {
          const assemblies = [];
          for (const a of b.assemblies) {
            assemblies.push(toAssemblyView(await updateVersioned<AssemblyRow>(trx, 'machine_assemblies', { id: a.id, production_id: productionId }, a.version, { section_id: b.sectionId }, `Assembly ${a.id}`, toAssemblyView)));
          }
          const lines = [];
          for (const l of b.lines) {
            const row = await updateVersioned<PartLineRow>(trx, 'machine_part_lines', { id: l.id, production_id: productionId }, l.version, { section_id: b.sectionId }, `Part line ${l.id}`, (r) => toPartLineView(r));
            lines.push({ id: row.id, sectionId: row.section_id, version: row.version });
          }
          return { assemblies, lines };
        });
        return { ...moved, massProperties: await machineMass(db, productionId) };
      },
    }),

    ...weighingRoutes(deps),
    ...meshRoutes(deps),
    ...importRoutes(deps),
  ];
}

/** Copies the given API fields to their columns. */
function pick(body: Record<string, unknown>, map: Record<string, string>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [key, col] of Object.entries(map)) if (body[key] !== undefined) out[col] = body[key];
  return out;
}

/** Quantity of a line with instances: the instance count (the core's rule); a different quantity is refused. */
function instanceQuantity(quantity: number | undefined, instances: unknown[]): number {
  if (instances.length === 0) return quantity ?? 1;
  if (quantity !== undefined && quantity !== instances.length) {
    throw invalid('Some fields are not valid.', [{ path: 'quantity', message: `Quantity ${quantity} differs from the ${instances.length} placed instances; with instances, each instance is one unit.` }]);
  }
  return instances.length;
}

async function uniqueOr409(db: Knex, table: string, where: Record<string, unknown>, message: string, field: string, exceptId?: string): Promise<void> {
  const q = db(table).where(where);
  if (exceptId) q.whereNot({ id: exceptId });
  if (await q.first('id')) throw new AppError('conflict', message, { issues: [{ path: field, message }] });
}

/** Referenced assemblies and sections must exist in this production (400 naming the field otherwise). */
async function checkRefs(db: Knex, productionId: string, refs: { parentId?: string | null; assemblyId?: string | null; sectionId?: string | null }): Promise<void> {
  const issues: FieldIssue[] = [];
  for (const [field, table] of [
    ['parentId', 'machine_assemblies'],
    ['assemblyId', 'machine_assemblies'],
    ['sectionId', 'machine_sections'],
  ] as const) {
    const id = refs[field];
    if (id && !(await db(table).where({ id, production_id: productionId }).first('id'))) {
      issues.push({ path: field, message: `No ${table === 'machine_sections' ? 'section' : 'assembly'} with id ${id} in this production.` });
    }
  }
  if (issues.length) throw invalid('Some fields are not valid.', issues);
}

/** An assembly may not move under itself or one of its own sub-assemblies. */
async function refuseCycle(db: Knex, productionId: string, id: string, parentId: string): Promise<void> {
  const { rows } = (await db.raw(
    `with recursive up(id, parent_id) as (
       select id, parent_id from machine_assemblies where id = ? and production_id = ?
       union all select a.id, a.parent_id from machine_assemblies a join up on a.id = up.parent_id)
     select 1 from up where id = ? limit 1`,
    [parentId, productionId, id],
  )) as { rows: unknown[] };
  if (rows.length) throw invalid('Some fields are not valid.', [{ path: 'parentId', message: 'An assembly cannot sit under itself or one of its own sub-assemblies.' }]);
}
