import type { Request } from 'express';
import type { Knex } from 'knex';
import {
  crateContentBody,
  createCrateBody,
  updateCrateBody,
  updateCrateContentBody,
  type CreateCrateBody,
  type UpdateCrateBody,
} from '../../../src/domain/contracts/crate-loads.ts';
import type { CrateDesignOptions } from '../../../src/domain/crates/index.ts';
import { can, route, uuidParam, type RouteDef } from '../../http/routes.ts';
import { AppError, invalid, notFound } from '../../http/errors.ts';
import { updateVersioned } from '../../http/versioned.ts';
import type { AppDeps } from '../../app.ts';
import { ensureLoadSettings, json, loadCrates, toContentView, toCrateView, toLoadSettingsView, type ContentRow, type CrateRow } from './crates.repository.ts';
import { designedColumns, sectionForCrate, stockColumns, STOCK_CATALOGUE } from './crates.service.ts';

/** A unique-code clash as a 400 naming the field (the database's unique index is the authority). */
function codeClash(e: unknown, codeValue: string): never {
  if ((e as { code?: string }).code === '23505') throw invalid(`A crate with code "${codeValue}" already exists.`, [{ path: 'code', message: `Code "${codeValue}" is taken.` }]);
  throw e;
}

/**
 * Crates of one production, under `/api/productions/:productionId/crates`: the catalogue (designed crates,
 * stock cases, pallets) and their contents. Every figure comes from the cores (crate design, tipping,
 * manual handling). Saves of existing rows go through updateVersioned (409 with the current record).
 */
export function crateRoutes(deps: AppDeps): RouteDef[] {
  const { db } = deps;
  const pid = (req: Request) => uuidParam(req, 'productionId');

  async function crateView(dbx: Knex, productionId: string, crateId: string) {
    // One query after another: dbx may be a transaction (one connection).
    const settings = await ensureLoadSettings(dbx, productionId);
    const found = await loadCrates(dbx, productionId, [crateId]);
    if (found.length === 0) throw notFound('The crate');
    return toCrateView(found[0].crate, found[0].contents, toLoadSettingsView(settings));
  }
  async function crateRow(dbx: Knex, productionId: string, crateId: string): Promise<CrateRow> {
    const row = await dbx<CrateRow>('crates').where({ id: crateId, production_id: productionId }).first();
    if (!row) throw notFound('The crate');
    return row;
  }

  return [
    route({
      method: 'get',
      path: '/',
      access: can('crate.read'),
      async handler(req) {
        const productionId = pid(req);
        const [settings, rows] = await Promise.all([ensureLoadSettings(db, productionId), loadCrates(db, productionId)]);
        const s = toLoadSettingsView(settings);
        return { crates: rows.map((r) => toCrateView(r.crate, r.contents, s)) };
      },
    }),
    route({
      method: 'get',
      path: '/stock-catalogue',
      access: can('crate.read'),
      handler: () => ({ items: STOCK_CATALOGUE }),
    }),
    route({
      method: 'get',
      path: '/:crateId',
      access: can('crate.read'),
      handler: async (req) => ({ crate: await crateView(db, pid(req), uuidParam(req, 'crateId')) }),
    }),
    route({
      method: 'post',
      path: '/',
      access: can('crate.edit'),
      body: createCrateBody,
      async handler(req, res) {
        const productionId = pid(req);
        const b = req.body as CreateCrateBody;
        const base = {
          production_id: productionId,
          code: b.code,
          name: b.name ?? '',
          kind: b.kind,
          may_tilt: b.mayTilt ?? false,
          this_way_up: b.thisWayUp ?? true,
          fragile: b.fragile ?? false,
          notes: b.notes ?? '',
        };
        // The section's mass properties are read before the transaction (many queries in parallel).
        const section = b.kind === 'designed' ? await sectionForCrate(db, productionId, b.sectionId!) : null;
        const id = await db.transaction(async (trx) => {
          let crateId: string;
          try {
            if (section) {
              const options: CrateDesignOptions = { ...b.designOptions, fragile: b.fragile ?? b.designOptions?.fragile, thisWayUp: b.thisWayUp ?? b.designOptions?.thisWayUp, stackable: b.stackable ?? b.designOptions?.stackable };
              const { columns, content } = designedColumns(section, options);
              const [row] = await trx('crates')
                .insert({ ...base, ...columns, section_id: section.id, name: b.name || section.name, ...(b.maxGrossKg !== undefined ? { max_gross_kg: b.maxGrossKg } : {}) })
                .returning('id');
              crateId = row.id;
              await trx('crate_contents').insert({ ...content, production_id: productionId, crate_id: crateId });
            } else {
              const columns = stockColumns(b);
              const [row] = await trx('crates')
                .insert({ ...base, ...columns, max_load_on_top_kg: b.maxLoadOnTopKg ?? null, ...(b.ispm15Required !== undefined ? { ispm15_required: b.ispm15Required } : {}) })
                .returning('id');
              crateId = row.id;
            }
          } catch (e) {
            codeClash(e, b.code);
          }
          return crateId;
        });
        res.status(201);
        return { crate: await crateView(db, productionId, id) };
      },
    }),
    route({
      method: 'patch',
      path: '/:crateId',
      access: can('crate.edit'),
      body: updateCrateBody,
      async handler(req) {
        const productionId = pid(req);
        const crateId = uuidParam(req, 'crateId');
        const b = req.body as UpdateCrateBody;
        const before = await crateRow(db, productionId, crateId);
        const redesign = before.kind === 'designed' && (b.redesign || b.designOptions) && before.section_id ? await sectionForCrate(db, productionId, before.section_id) : null;
        await db.transaction(async (trx) => {
          const current = await crateRow(trx, productionId, crateId);
          const changes: Record<string, unknown> = {};
          const set = (col: string, v: unknown) => v !== undefined && (changes[col] = v);
          set('code', b.code);
          set('name', b.name);
          set('notes', b.notes);
          set('stackable', b.stackable);
          set('max_load_on_top_kg', b.maxLoadOnTopKg);
          set('this_way_up', b.thisWayUp);
          set('fragile', b.fragile);
          set('may_tilt', b.mayTilt);
          set('ispm15_required', b.ispm15Required);
          set('max_gross_kg', b.maxGrossKg);
          let newContent: Record<string, unknown> | null = null;
          if (current.kind === 'designed' && (b.redesign || b.designOptions)) {
            if (b.outerMm || b.innerMm !== undefined || b.tareKg !== undefined) {
              throw invalid('A designed crate takes its size and tare from its design: change the design options instead.', [{ path: 'outerMm', message: 'Set by the design.' }]);
            }
            if (!current.section_id || !redesign || redesign.id !== current.section_id) {
              throw invalid('This crate has lost its section: it cannot be designed again.', [{ path: 'redesign', message: 'No section.' }]);
            }
            const section = redesign;
            const previous = (current.design?.options ?? {}) as CrateDesignOptions;
            const options: CrateDesignOptions = {
              ...(b.designOptions ?? previous),
              fragile: b.fragile ?? current.fragile,
              thisWayUp: b.thisWayUp ?? current.this_way_up,
              stackable: b.stackable ?? current.stackable,
            };
            const { columns, content } = designedColumns(section, options);
            Object.assign(changes, columns, b.maxGrossKg !== undefined ? { max_gross_kg: b.maxGrossKg } : {}, b.ispm15Required !== undefined ? { ispm15_required: b.ispm15Required } : {});
            newContent = content;
          } else if (b.designOptions || b.redesign) {
            throw invalid('Only a designed crate has design options.', [{ path: 'designOptions', message: 'Not a designed crate.' }]);
          } else {
            if (b.outerMm) Object.assign(changes, { outer_length_mm: b.outerMm[0], outer_width_mm: b.outerMm[1], outer_height_mm: b.outerMm[2] });
            if (b.innerMm !== undefined) Object.assign(changes, { inner_length_mm: b.innerMm?.[0] ?? null, inner_width_mm: b.innerMm?.[1] ?? null, inner_height_mm: b.innerMm?.[2] ?? null });
            set('tare_kg', b.tareKg);
            if (b.outerMm && current.kind !== 'designed') {
              const tareCog = current.kind === 'pallet' ? [b.outerMm[0] / 2, b.outerMm[1] / 2, current.design?.tareCogMm?.[2] ?? 72] : [b.outerMm[0] / 2, b.outerMm[1] / 2, b.outerMm[2] / 2];
              changes.design = json({ ...current.design, tareCogMm: tareCog });
            }
          }
          try {
            await updateVersioned<CrateRow>(trx, 'crates', { id: crateId, production_id: productionId }, b.version, changes, 'The crate');
          } catch (e) {
            if (e instanceof AppError && e.kind === 'conflict') throw new AppError('conflict', e.message, { current: await crateView(trx, productionId, crateId) });
            codeClash(e, b.code ?? '');
          }
          if (newContent) {
            await trx('crate_contents').where({ crate_id: crateId, section_id: current.section_id }).delete();
            await trx('crate_contents').insert({ ...newContent, production_id: productionId, crate_id: crateId });
          }
        });
        return { crate: await crateView(db, productionId, crateId) };
      },
    }),
    route({
      method: 'delete',
      path: '/:crateId',
      access: can('crate.edit'),
      async handler(req) {
        const n = await db('crates').where({ id: uuidParam(req, 'crateId'), production_id: pid(req) }).delete();
        if (n === 0) throw notFound('The crate');
      },
    }),

    // ----------------------------------------------------------------------------------- contents
    route({
      method: 'post',
      path: '/:crateId/contents',
      access: can('crate.edit'),
      body: crateContentBody,
      async handler(req, res) {
        const productionId = pid(req);
        const crateId = uuidParam(req, 'crateId');
        const b = req.body as ReturnType<typeof crateContentBody.parse>;
        await crateRow(db, productionId, crateId);
        let massKg = b.massKg;
        let description = b.description;
        if (b.partLineId) {
          const line = await db('machine_part_lines').where({ id: b.partLineId, production_id: productionId }).first('part_number', 'name', 'unit_mass_kg');
          if (!line) throw invalid('No such part line in this production.', [{ path: 'partLineId', message: 'Pick a part line of this production.' }]);
          // A line left without a mass takes the breakdown's unit mass × quantity (null stays unknown).
          if (massKg === undefined) massKg = line.unit_mass_kg === null ? null : Number(line.unit_mass_kg) * b.quantity;
          if (!description) description = `${line.part_number}${line.name ? ` ${line.name}` : ''}`;
        }
        if (b.sectionId) {
          const s = await db('machine_sections').where({ id: b.sectionId, production_id: productionId }).first('code', 'name');
          if (!s) throw invalid('No such section in this production.', [{ path: 'sectionId', message: 'Pick a section of this production.' }]);
          if (!description) description = `Section ${s.code}${s.name ? ` — ${s.name}` : ''}`;
        }
        const { max } = (await db('crate_contents').where({ crate_id: crateId }).max('sort_order as max').first()) as { max: number | null };
        const [row] = await db<ContentRow>('crate_contents')
          .insert({
            production_id: productionId,
            crate_id: crateId,
            part_line_id: b.partLineId ?? null,
            section_id: b.sectionId ?? null,
            description,
            quantity: b.quantity,
            mass_kg: massKg ?? null,
            cog_mm: json(b.cogMm ?? null) as never,
            sort_order: (max ?? 0) + 1,
          })
          .returning('*');
        res.status(201);
        return { content: toContentView(row), crate: await crateView(db, productionId, crateId) };
      },
    }),
    route({
      method: 'patch',
      path: '/:crateId/contents/:contentId',
      access: can('crate.edit'),
      body: updateCrateContentBody,
      async handler(req) {
        const productionId = pid(req);
        const crateId = uuidParam(req, 'crateId');
        const b = req.body as ReturnType<typeof updateCrateContentBody.parse>;
        const changes: Record<string, unknown> = {};
        if (b.description !== undefined) changes.description = b.description;
        if (b.quantity !== undefined) changes.quantity = b.quantity;
        if (b.massKg !== undefined) changes.mass_kg = b.massKg;
        if (b.cogMm !== undefined) changes.cog_mm = json(b.cogMm);
        const row = await updateVersioned<ContentRow>(db, 'crate_contents', { id: uuidParam(req, 'contentId'), crate_id: crateId, production_id: productionId }, b.version, changes, 'The content line', toContentView);
        return { content: toContentView(row), crate: await crateView(db, productionId, crateId) };
      },
    }),
    route({
      method: 'delete',
      path: '/:crateId/contents/:contentId',
      access: can('crate.edit'),
      async handler(req) {
        const n = await db('crate_contents').where({ id: uuidParam(req, 'contentId'), crate_id: uuidParam(req, 'crateId'), production_id: pid(req) }).delete();
        if (n === 0) throw notFound('The content line');
      },
    }),
  ];
}
