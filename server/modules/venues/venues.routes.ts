import type { Request } from 'express';
import {
  createVenueBody,
  hangingPointBody,
  updateHangingPointBody,
  updateVenueBody,
  type CreateVenueBody,
  type HangingPointBody,
  type HangingPointView,
  type UpdateHangingPointBody,
  type UpdateVenueBody,
} from '../../../src/domain/contracts/tour.ts';
import { can, route, uuidParam, type RouteDef } from '../../http/routes.ts';
import { AppError, invalid, notFound } from '../../http/errors.ts';
import { updateVersioned } from '../../http/versioned.ts';
import type { AppDeps } from '../../app.ts';
import { pgCode, productionOf, requireVenueScope, toVenueView, venueScopeOf, type VenueRow } from '../tour/tour.repository.ts';
import { crateRow, runMatrix, sectionRows, vehicleOptions, venueForCore } from '../tour/access.service.ts';
import { loadCrates } from '../tour/tour.repository.ts';

interface HangingPointRow {
  id: string;
  venue_id: string;
  name: string;
  wll_kg: number | null;
  height_mm: number | null;
  location: string;
  notes: string;
  version: number;
}

const toHangingPointView = (r: HangingPointRow): HangingPointView => ({
  id: r.id,
  venueId: r.venue_id,
  name: r.name,
  wllKg: r.wll_kg === null ? null : Number(r.wll_kg),
  heightMm: r.height_mm === null ? null : Number(r.height_mm),
  location: r.location,
  notes: r.notes,
  version: r.version,
});

/**
 * Venues of a production under `/api/productions/:productionId/venues`: their access data, contacts and
 * hanging points. Planners create and edit every venue; venue staff read and edit their own venues only
 * (the policy's venue scope, checked once the venue is known), and another venue's id gets 403 whether it
 * exists or not.
 */
export function venueRoutes(deps: AppDeps): RouteDef[] {
  const { db } = deps;

  async function loadVenue(req: Request, action: 'venue.read' | 'venue.edit' | 'tour.edit'): Promise<VenueRow> {
    const productionId = productionOf(req);
    const venueId = uuidParam(req, 'venueId');
    // Scope first: a venue user learns nothing about venues that are not theirs.
    if (action !== 'tour.edit') requireVenueScope(req, action, productionId, venueId);
    const row = (await db<VenueRow>('venues').where({ id: venueId, production_id: productionId }).first()) as VenueRow | undefined;
    if (!row) throw notFound('The venue');
    return row;
  }

  function venueChanges(b: Partial<CreateVenueBody>): Record<string, unknown> {
    const c: Record<string, unknown> = {};
    if (b.name !== undefined) c.name = b.name;
    if (b.city !== undefined) c.city = b.city;
    if (b.country !== undefined) c.country = b.country;
    if (b.address !== undefined) c.address = b.address;
    if (b.notes !== undefined) c.notes = b.notes;
    if (b.paperworkUnits !== undefined) c.paperwork_units = b.paperworkUnits;
    if (b.access !== undefined) c.access = JSON.stringify(b.access);
    if (b.contacts !== undefined) c.contacts = JSON.stringify(b.contacts);
    return c;
  }

  return [
    route({
      method: 'get',
      path: '/',
      access: can('venue.read'),
      async handler(req) {
        const productionId = productionOf(req);
        const scope = venueScopeOf(req, productionId);
        const q = db<VenueRow>('venues').where({ production_id: productionId }).orderBy('name');
        if (scope) q.whereIn('id', scope.length ? scope : ['00000000-0000-0000-0000-000000000000']);
        return { venues: ((await q) as VenueRow[]).map(toVenueView) };
      },
    }),
    route({
      method: 'post',
      path: '/',
      access: can('tour.edit'),
      body: createVenueBody,
      async handler(req, res) {
        const productionId = productionOf(req);
        const [row] = await db('venues')
          .insert({ production_id: productionId, ...venueChanges(req.body as CreateVenueBody) })
          .returning('*');
        res.status(201).json({ venue: toVenueView(row) });
      },
    }),
    route({
      method: 'get',
      path: '/:venueId',
      access: can('venue.read'),
      async handler(req) {
        return { venue: toVenueView(await loadVenue(req, 'venue.read')) };
      },
    }),
    route({
      method: 'patch',
      path: '/:venueId',
      access: can('venue.edit'),
      body: updateVenueBody,
      async handler(req) {
        const venue = await loadVenue(req, 'venue.edit');
        const b = req.body as UpdateVenueBody;
        const row = await updateVersioned<VenueRow>(db, 'venues', { id: venue.id, production_id: venue.production_id }, b.version, venueChanges(b), 'The venue', toVenueView);
        return { venue: toVenueView(row) };
      },
    }),
    route({
      method: 'delete',
      path: '/:venueId',
      access: can('tour.edit'),
      async handler(req) {
        const venue = await loadVenue(req, 'tour.edit');
        const used = await db('engagements').where({ venue_id: venue.id }).count<{ count: number }[]>('* as count');
        if (Number(used[0].count) > 0) throw new AppError('conflict', `${venue.name} has ${used[0].count} engagement(s) on the tour; remove those first.`);
        try {
          await db('venues').where({ id: venue.id }).delete();
        } catch (err) {
          if (pgCode(err) === '23503') throw new AppError('conflict', `${venue.name} is still in use (people or engagements refer to it).`);
          throw err;
        }
      },
    }),

    // Every crate and section of the production against this venue (no delivering vehicle: the tour matrix
    // checks the dock against each leg's vehicle).
    route({
      method: 'get',
      path: '/:venueId/access-check',
      access: can('venue.read'),
      async handler(req) {
        const venue = await loadVenue(req, 'venue.read');
        const [crates, sections] = await Promise.all([loadCrates(db, venue.production_id), sectionRows(db, venue.production_id)]);
        const view = runMatrix({
          rows: [...crates.map(crateRow), ...sections],
          columns: [
            {
              venueId: venue.id,
              engagementId: venue.id,
              venueName: venue.name,
              city: venue.city,
              loadInOn: '',
              vehicleName: null,
              venue: { id: venue.id, name: venue.name, access: venueForCore(venue.access), options: vehicleOptions(undefined) },
            },
          ],
        });
        return { check: view };
      },
    }),

    // ---------------------------------------------------------------------------- hanging points
    route({
      method: 'get',
      path: '/:venueId/hanging-points',
      access: can('venue.read'),
      async handler(req) {
        const venue = await loadVenue(req, 'venue.read');
        const rows = (await db('venue_hanging_points').where({ venue_id: venue.id }).orderBy('name')) as HangingPointRow[];
        return { hangingPoints: rows.map(toHangingPointView) };
      },
    }),
    route({
      method: 'post',
      path: '/:venueId/hanging-points',
      access: can('venue.edit'),
      body: hangingPointBody,
      async handler(req, res) {
        const venue = await loadVenue(req, 'venue.edit');
        const b = req.body as HangingPointBody;
        try {
          const [row] = await db('venue_hanging_points')
            .insert({ production_id: venue.production_id, venue_id: venue.id, name: b.name, wll_kg: b.wllKg, height_mm: b.heightMm, location: b.location, notes: b.notes })
            .returning('*');
          res.status(201).json({ hangingPoint: toHangingPointView(row) });
        } catch (err) {
          if (pgCode(err) === '23505') throw invalid(`A hanging point named "${b.name}" exists already at ${venue.name}.`, [{ path: 'name', message: 'Already used at this venue.' }]);
          throw err;
        }
      },
    }),
    route({
      method: 'patch',
      path: '/:venueId/hanging-points/:pointId',
      access: can('venue.edit'),
      body: updateHangingPointBody,
      async handler(req) {
        const venue = await loadVenue(req, 'venue.edit');
        const b = req.body as UpdateHangingPointBody;
        const changes: Record<string, unknown> = {};
        if (b.name !== undefined) changes.name = b.name;
        if (b.wllKg !== undefined) changes.wll_kg = b.wllKg;
        if (b.heightMm !== undefined) changes.height_mm = b.heightMm;
        if (b.location !== undefined) changes.location = b.location;
        if (b.notes !== undefined) changes.notes = b.notes;
        const row = await updateVersioned<HangingPointRow>(
          db,
          'venue_hanging_points',
          { id: uuidParam(req, 'pointId'), venue_id: venue.id },
          b.version,
          changes,
          'The hanging point',
          toHangingPointView,
        );
        return { hangingPoint: toHangingPointView(row) };
      },
    }),
    route({
      method: 'delete',
      path: '/:venueId/hanging-points/:pointId',
      access: can('venue.edit'),
      async handler(req) {
        const venue = await loadVenue(req, 'venue.edit');
        const n = await db('venue_hanging_points').where({ id: uuidParam(req, 'pointId'), venue_id: venue.id }).delete();
        if (!n) throw notFound('The hanging point');
      },
    }),
  ];
}
