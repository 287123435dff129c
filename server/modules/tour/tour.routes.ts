import type { Knex } from 'knex';
import {
  createEngagementBody,
  createLegBody,
  engagementDateProblems,
  updateEngagementBody,
  updateLegBody,
  type CreateEngagementBody,
  type CreateLegBody,
  type UpdateEngagementBody,
  type UpdateLegBody,
} from '../../../src/domain/contracts/tour.ts';
import { can, route, uuidParam, type RouteDef } from '../../http/routes.ts';
import { AppError, invalid, notFound, type FieldIssue } from '../../http/errors.ts';
import { updateVersioned } from '../../http/versioned.ts';
import type { AppDeps } from '../../app.ts';
import {
  engagementsQuery,
  findEngagement,
  loadCrates,
  loadLegs,
  loadVehicles,
  pgCode,
  productionOf,
  toEngagementView,
  venueScopeOf,
  type EngagementRow,
  type LegRow,
} from './tour.repository.ts';
import { tourMatrix } from './access.service.ts';
import { checkInRoutes } from './checkin.routes.ts';
import { manifestRoutes } from './manifest.routes.ts';

/**
 * The tour of one production under `/api/productions/:productionId/tour`: engagements, legs with their
 * vehicles and crates, the access matrix, manifests and their e-mail, and check-in. Venue staff see only
 * the engagements at their own venues.
 */
export function tourRoutes(deps: AppDeps): RouteDef[] {
  const { db } = deps;

  async function ensureVenue(productionId: string, venueId: string) {
    const v = await db('venues').where({ id: venueId, production_id: productionId }).first('id');
    if (!v) throw invalid('No such venue in this production.', [{ path: 'venueId', message: `No venue with id ${venueId} in this production.` }]);
  }

  async function ensureEngagement(productionId: string, id: string, field: string) {
    const e = await db('engagements').where({ id, production_id: productionId }).first('id');
    if (!e) throw invalid('No such engagement in this production.', [{ path: field, message: `No engagement with id ${id} in this production.` }]);
  }

  async function ensureMembers(trx: Knex, productionId: string, table: 'vehicles' | 'crates', ids: string[], field: string) {
    if (!ids.length) return;
    const found: string[] = await trx(table).where({ production_id: productionId }).whereIn('id', ids).pluck('id');
    const issues: FieldIssue[] = ids.map((id, i) => (found.includes(id) ? null : { path: `${field}.${i}`, message: `No ${table === 'vehicles' ? 'vehicle' : 'crate'} with id ${id} in this production.` })).filter((x): x is FieldIssue => x !== null);
    if (issues.length) throw invalid(`Some ${table} are not part of this production.`, issues);
    if (new Set(ids).size !== ids.length) throw invalid(`A ${table === 'vehicles' ? 'vehicle' : 'crate'} is listed twice.`, [{ path: field, message: 'Each may appear once.' }]);
  }

  async function legVersion(legId: string) {
    const leg = (await db<LegRow>('tour_legs').where({ id: legId }).first()) as LegRow;
    return (await loadLegs(db, leg.production_id)).find((l) => l.id === legId)!;
  }

  return [
    route({
      method: 'get',
      path: '/',
      access: can('engagement.read'),
      async handler(req) {
        const productionId = productionOf(req);
        const scope = venueScopeOf(req, productionId);
        const engagements = ((await engagementsQuery(db, productionId)) as EngagementRow[]).map(toEngagementView).filter((e) => !scope || scope.includes(e.venueId));
        const visible = new Set(engagements.map((e) => e.id));
        const [legs, vehicles, crates, venues] = await Promise.all([
          loadLegs(db, productionId),
          scope ? Promise.resolve([]) : loadVehicles(db, productionId),
          scope ? Promise.resolve([]) : loadCrates(db, productionId),
          db('venues').where({ production_id: productionId }).orderBy('name').select('id', 'name', 'city'),
        ]);
        return {
          tour: {
            engagements,
            legs: legs.filter((l) => !scope || visible.has(l.toEngagementId)),
            vehicles: vehicles.map((v) => ({ id: v.id, code: v.code, name: v.name, kind: v.kind })),
            crates,
            venues: venues.filter((v) => !scope || scope.includes(v.id)),
          },
        };
      },
    }),

    // ------------------------------------------------------------------------------- engagements
    route({
      method: 'post',
      path: '/engagements',
      access: can('tour.edit'),
      body: createEngagementBody,
      async handler(req, res) {
        const productionId = productionOf(req);
        const b = req.body as CreateEngagementBody;
        await ensureVenue(productionId, b.venueId);
        const max = await db('engagements').where({ production_id: productionId }).max<{ max: number | null }[]>('sort_order as max');
        const [row] = await db('engagements')
          .insert({
            production_id: productionId,
            venue_id: b.venueId,
            load_in_on: b.loadInOn,
            show_first_on: b.showFirstOn,
            show_last_on: b.showLastOn,
            load_out_on: b.loadOutOn,
            notes: b.notes,
            sort_order: (max[0].max ?? -1) + 1,
          })
          .returning('id');
        res.status(201).json({ engagement: toEngagementView(await findEngagement(db, productionId, row.id)) });
      },
    }),
    route({
      method: 'patch',
      path: '/engagements/:engagementId',
      access: can('tour.edit'),
      body: updateEngagementBody,
      async handler(req) {
        const productionId = productionOf(req);
        const current = toEngagementView(await findEngagement(db, productionId, uuidParam(req, 'engagementId')));
        const b = req.body as UpdateEngagementBody;
        if (b.venueId) await ensureVenue(productionId, b.venueId);
        const merged = { ...current, ...Object.fromEntries(Object.entries(b).filter(([, v]) => v !== undefined)) };
        const problems = engagementDateProblems(merged);
        if (problems.length) throw invalid('The dates are not in order.', problems);
        const changes: Record<string, unknown> = {};
        if (b.venueId !== undefined) changes.venue_id = b.venueId;
        if (b.loadInOn !== undefined) changes.load_in_on = b.loadInOn;
        if (b.showFirstOn !== undefined) changes.show_first_on = b.showFirstOn;
        if (b.showLastOn !== undefined) changes.show_last_on = b.showLastOn;
        if (b.loadOutOn !== undefined) changes.load_out_on = b.loadOutOn;
        if (b.notes !== undefined) changes.notes = b.notes;
        if (b.sortOrder !== undefined) changes.sort_order = b.sortOrder;
        try {
          await updateVersioned<EngagementRow>(db, 'engagements', { id: current.id, production_id: productionId }, b.version, changes, 'The engagement', (r) =>
            toEngagementView({ ...r, venue_name: current.venueName, venue_city: current.venueCity }),
          );
        } catch (err) {
          if (pgCode(err) === '23514') throw invalid('The dates are not in order (load-in ≤ first show ≤ last show ≤ load-out).');
          throw err;
        }
        return { engagement: toEngagementView(await findEngagement(db, productionId, current.id)) };
      },
    }),
    route({
      method: 'delete',
      path: '/engagements/:engagementId',
      access: can('tour.edit'),
      async handler(req) {
        const productionId = productionOf(req);
        const id = uuidParam(req, 'engagementId');
        const scans = await db('crate_scans').where({ engagement_id: id, production_id: productionId }).count<{ count: number }[]>('* as count');
        if (Number(scans[0].count) > 0) throw new AppError('conflict', `This engagement has ${scans[0].count} check-in scan(s); it is kept as the record of what arrived.`);
        const n = await db('engagements').where({ id, production_id: productionId }).delete();
        if (!n) throw notFound('The engagement');
      },
    }),

    // ---------------------------------------------------------------------------------------- legs
    route({
      method: 'post',
      path: '/legs',
      access: can('tour.edit'),
      body: createLegBody,
      async handler(req, res) {
        const productionId = productionOf(req);
        const b = req.body as CreateLegBody;
        await ensureEngagement(productionId, b.toEngagementId, 'toEngagementId');
        if (b.fromEngagementId) await ensureEngagement(productionId, b.fromEngagementId, 'fromEngagementId');
        if (b.fromEngagementId === b.toEngagementId) throw invalid('A leg must go somewhere else.', [{ path: 'fromEngagementId', message: 'The leg starts where it ends.' }]);
        const id = await db.transaction(async (trx) => {
          await ensureMembers(trx, productionId, 'vehicles', b.vehicleIds, 'vehicleIds');
          const crateIds: string[] = b.crateIds ?? (await trx('crates').where({ production_id: productionId }).orderBy('code').pluck('id'));
          await ensureMembers(trx, productionId, 'crates', crateIds, 'crateIds');
          let row: { id: string };
          try {
            [row] = await trx('tour_legs')
              .insert({ production_id: productionId, from_engagement_id: b.fromEngagementId, to_engagement_id: b.toEngagementId, departs_on: b.departsOn, notes: b.notes })
              .returning('id');
          } catch (err) {
            if (pgCode(err) === '23505') throw new AppError('conflict', 'A leg to this engagement exists already; edit that one.');
            throw err;
          }
          if (b.vehicleIds.length) await trx('leg_vehicles').insert(b.vehicleIds.map((v, i) => ({ leg_id: row.id, vehicle_id: v, sort_order: i })));
          if (crateIds.length) await trx('leg_crates').insert(crateIds.map((c, i) => ({ leg_id: row.id, crate_id: c, load_order: i })));
          return row.id;
        });
        res.status(201).json({ leg: await legVersion(id) });
      },
    }),
    route({
      method: 'patch',
      path: '/legs/:legId',
      access: can('tour.edit'),
      body: updateLegBody,
      async handler(req) {
        const productionId = productionOf(req);
        const legId = uuidParam(req, 'legId');
        const b = req.body as UpdateLegBody;
        if (b.fromEngagementId) await ensureEngagement(productionId, b.fromEngagementId, 'fromEngagementId');
        await db.transaction(async (trx) => {
          const changes: Record<string, unknown> = {};
          if (b.fromEngagementId !== undefined) changes.from_engagement_id = b.fromEngagementId;
          if (b.departsOn !== undefined) changes.departs_on = b.departsOn;
          if (b.notes !== undefined) changes.notes = b.notes;
          // The version guards the whole leg, its vehicles and crates included.
          await updateVersioned<LegRow>(trx, 'tour_legs', { id: legId, production_id: productionId }, b.version, changes, 'The leg');
          if (b.vehicleIds) {
            await ensureMembers(trx, productionId, 'vehicles', b.vehicleIds, 'vehicleIds');
            await trx('leg_vehicles').where({ leg_id: legId }).delete();
            if (b.vehicleIds.length) await trx('leg_vehicles').insert(b.vehicleIds.map((v, i) => ({ leg_id: legId, vehicle_id: v, sort_order: i })));
          }
          if (b.crates) {
            await ensureMembers(trx, productionId, 'crates', b.crates.map((c) => c.crateId), 'crates');
            const vehicleIds = [...new Set(b.crates.map((c) => c.vehicleId).filter((v): v is string => Boolean(v)))];
            await ensureMembers(trx, productionId, 'vehicles', vehicleIds, 'crates.vehicleId');
            await trx('leg_crates').where({ leg_id: legId }).delete();
            if (b.crates.length) await trx('leg_crates').insert(b.crates.map((c, i) => ({ leg_id: legId, crate_id: c.crateId, vehicle_id: c.vehicleId, load_order: i })));
          }
        });
        return { leg: await legVersion(legId) };
      },
    }),
    route({
      method: 'delete',
      path: '/legs/:legId',
      access: can('tour.edit'),
      async handler(req) {
        const n = await db('tour_legs').where({ id: uuidParam(req, 'legId'), production_id: productionOf(req) }).delete();
        if (!n) throw notFound('The leg');
      },
    }),

    // ---------------------------------------------------------------------------- access matrix
    route({
      method: 'get',
      path: '/access-matrix',
      access: can('tour.read'),
      handler: async (req) => ({ matrix: await tourMatrix(db, productionOf(req)) }),
    }),

    ...manifestRoutes(deps),
    ...checkInRoutes(deps),
  ];
}
