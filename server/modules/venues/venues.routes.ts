import type { Request } from 'express';
import { createVenueBody, updateVenueBody, type CreateVenueBody, type UpdateVenueBody } from '../../../src/domain/contracts/tour.ts';
import { can, route, uuidParam, type RouteDef } from '../../http/routes.ts';
import { AppError, notFound } from '../../http/errors.ts';
import { updateVersioned } from '../../http/versioned.ts';
import type { AppDeps } from '../../app.ts';
import { pgCode, productionOf, requireVenueScope, toVenueView, venueScopeOf, type VenueRow } from '../tour/tour.repository.ts';
import { crateRow, runMatrix, sectionRows, venueForCore } from '../tour/access.service.ts';
import { loadCrates } from '../tour/tour.repository.ts';

/**
 * Venues of a production under `/api/productions/:productionId/venues`: their access data and contacts
 * (hanging points are kept by the lifting module, under /lifting/hanging-points). Planners create and edit
 * every venue; venue staff read and edit their own venues only (the policy's venue scope, checked once the
 * venue is known), and another venue's id gets 403 whether it exists or not.
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
              venue: { id: venue.id, name: venue.name, access: venueForCore(venue.access) },
            },
          ],
        });
        return { check: view };
      },
    }),

  ];
}
