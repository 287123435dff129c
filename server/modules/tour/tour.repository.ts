import type { Knex } from 'knex';
import type { Request } from 'express';
import type { EngagementView, LegView, TourCrateView, VenueAccessData, VenueContact, VenueView } from '../../../src/domain/contracts/tour.ts';
import { decide, type Action } from '../../../src/domain/policy/index.ts';
import { forbidden, notFound } from '../../http/errors.ts';

/**
 * Rows of the tour tables and their views. The repository alone talks to the database; every query is
 * scoped by the production in the path.
 */

export interface VenueRow {
  id: string;
  production_id: string;
  name: string;
  city: string;
  country: string;
  address: string;
  notes: string;
  paperwork_units: 'metric' | 'imperial' | null;
  access: VenueAccessData;
  contacts: VenueContact[];
  version: number;
  updated_at: Date;
}

export interface EngagementRow {
  id: string;
  production_id: string;
  venue_id: string;
  venue_name?: string;
  venue_city?: string;
  sort_order: number;
  load_in_on: Date | string;
  show_first_on: Date | string;
  show_last_on: Date | string;
  load_out_on: Date | string;
  notes: string;
  version: number;
}

export interface LegRow {
  id: string;
  production_id: string;
  from_engagement_id: string | null;
  to_engagement_id: string;
  departs_on: Date | string | null;
  notes: string;
  version: number;
}

/** A `date` column as YYYY-MM-DD. node-postgres reads dates as local midnight, so local fields are right. */
export function isoDay(d: Date | string | null): string | null {
  if (d === null) return null;
  if (typeof d === 'string') return d.slice(0, 10);
  const p = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${p(d.getMonth() + 1)}-${p(d.getDate())}`;
}

export function toVenueView(r: VenueRow): VenueView {
  return {
    id: r.id,
    name: r.name,
    city: r.city,
    country: r.country,
    address: r.address,
    notes: r.notes,
    paperworkUnits: r.paperwork_units,
    access: r.access ?? { doors: [] },
    contacts: r.contacts ?? [],
    version: r.version,
    updatedAt: new Date(r.updated_at).toISOString(),
  };
}

export function toEngagementView(r: EngagementRow): EngagementView {
  return {
    id: r.id,
    venueId: r.venue_id,
    venueName: r.venue_name ?? '',
    venueCity: r.venue_city ?? '',
    sortOrder: r.sort_order,
    loadInOn: isoDay(r.load_in_on)!,
    showFirstOn: isoDay(r.show_first_on)!,
    showLastOn: isoDay(r.show_last_on)!,
    loadOutOn: isoDay(r.load_out_on)!,
    notes: r.notes,
    version: r.version,
  };
}

/** Engagements of a production in tour order, with their venue's name. */
export function engagementsQuery(db: Knex, productionId: string) {
  return db<EngagementRow>('engagements as e')
    .join('venues as v', 'v.id', 'e.venue_id')
    .where('e.production_id', productionId)
    .orderBy([{ column: 'e.load_in_on' }, { column: 'e.sort_order' }, { column: 'v.name' }])
    .select('e.*', 'v.name as venue_name', 'v.city as venue_city');
}

export async function findEngagement(db: Knex, productionId: string, engagementId: string): Promise<EngagementRow> {
  const row = (await engagementsQuery(db, productionId).where('e.id', engagementId).first()) as EngagementRow | undefined;
  if (!row) throw notFound('The engagement');
  return row;
}

export interface CrateRow {
  id: string;
  code: string;
  name: string;
  outer_length_mm: number;
  outer_width_mm: number;
  outer_height_mm: number;
  tare_kg: number;
  may_tilt: boolean;
  /** Sum of the contents' masses; null while any content's mass is unknown. */
  contents_kg: number | null;
}

/**
 * The production's crates with their gross mass: tare plus every content line. A content line of unknown
 * mass makes the gross unknown (never counted as zero), so the access checks say "unknown" for it.
 */
export async function loadCrates(db: Knex, productionId: string): Promise<TourCrateView[]> {
  const rows = (await db('crates as c')
    .where('c.production_id', productionId)
    .orderBy('c.code')
    .select(
      'c.id',
      'c.code',
      'c.name',
      'c.outer_length_mm',
      'c.outer_width_mm',
      'c.outer_height_mm',
      'c.tare_kg',
      'c.may_tilt',
      db.raw(
        `(select case when bool_or(cc.mass_kg is null) then null else coalesce(sum(cc.mass_kg), 0) end from crate_contents cc where cc.crate_id = c.id) as contents_kg`,
      ),
    )) as CrateRow[];
  return rows.map((r) => ({
    id: r.id,
    code: r.code,
    name: r.name,
    lengthMm: Number(r.outer_length_mm),
    widthMm: Number(r.outer_width_mm),
    heightMm: Number(r.outer_height_mm),
    tareKg: Number(r.tare_kg),
    grossKg: r.contents_kg === null ? null : Number(r.tare_kg) + Number(r.contents_kg),
    mayTilt: r.may_tilt,
  }));
}

export interface VehicleRow {
  id: string;
  code: string;
  name: string;
  kind: string;
  spec: { bedHeightMm?: number; tailLiftCapacityKg?: number | null } | null;
}

export async function loadVehicles(db: Knex, productionId: string): Promise<VehicleRow[]> {
  return (await db('vehicles').where({ production_id: productionId }).orderBy('code').select('id', 'code', 'name', 'kind', 'spec')) as VehicleRow[];
}

/** Legs with their vehicles and crates (only crates and vehicles that still exist). */
export async function loadLegs(db: Knex, productionId: string): Promise<LegView[]> {
  const legs = (await db<LegRow>('tour_legs').where({ production_id: productionId })) as LegRow[];
  if (legs.length === 0) return [];
  const ids = legs.map((l) => l.id);
  const [vehicles, crates] = await Promise.all([
    db('leg_vehicles as lv').join('vehicles as v', 'v.id', 'lv.vehicle_id').whereIn('lv.leg_id', ids).orderBy(['lv.leg_id', 'lv.sort_order']).select('lv.leg_id', 'v.id', 'v.code', 'v.name'),
    db('leg_crates as lc')
      .join('crates as c', 'c.id', 'lc.crate_id')
      .whereIn('lc.leg_id', ids)
      .orderBy([{ column: 'lc.leg_id' }, { column: 'lc.load_order' }, { column: 'c.code' }])
      .select('lc.leg_id', 'lc.crate_id', 'c.code', 'lc.vehicle_id', 'lc.load_order'),
  ]);
  return legs.map((l) => ({
    id: l.id,
    fromEngagementId: l.from_engagement_id,
    toEngagementId: l.to_engagement_id,
    departsOn: isoDay(l.departs_on),
    notes: l.notes,
    vehicles: vehicles.filter((v) => v.leg_id === l.id).map((v) => ({ id: v.id, code: v.code, name: v.name })),
    crates: crates.filter((c) => c.leg_id === l.id).map((c) => ({ crateId: c.crate_id, code: c.code, vehicleId: c.vehicle_id, loadOrder: c.load_order })),
    version: l.version,
  }));
}

/** The production id of the path (a uuid, else 404). */
export function productionOf(req: Request): string {
  const v = req.params.productionId;
  if (typeof v !== 'string' || !/^[0-9a-f-]{36}$/i.test(v)) throw notFound('The production');
  return v;
}

/**
 * The fine check after the route's role check: a venue user works only on their own venues. The reason
 * of the refusal goes back as it is ("This belongs to another venue.").
 */
export function requireVenueScope(req: Request, action: Action, productionId: string, venueId: string): void {
  const d = decide(req.actor!, action, { productionId, venueId });
  if (!d.allowed) throw forbidden(d.reason);
}

/** The venues a venue user may see; null for roles that see every venue. */
export function venueScopeOf(req: Request, productionId: string): string[] | null {
  const m = req.actor!.memberships.find((x) => x.productionId === productionId);
  return m?.role === 'venue' ? m.venueIds : null;
}

/** PostgreSQL errors by meaning, for services that turn them into AppErrors. */
export function pgCode(err: unknown): string | undefined {
  return (err as { code?: string })?.code;
}
