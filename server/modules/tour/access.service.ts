import type { Knex } from 'knex';
import { accessMatrix, type AccessOptions, type AccessVenue, type MatrixCrate, type MatrixVenue } from '../../../src/domain/access/index.ts';
import type { AccessMatrixView, LegView, MatrixColumnView, MatrixRowView, TourCrateView, VenueAccessData } from '../../../src/domain/contracts/tour.ts';
import { machineMass } from '../machine/mass.service.ts';
import { engagementsQuery, loadCrates, loadLegs, loadVehicles, toEngagementView, type VehicleRow, type VenueRow } from './tour.repository.ts';

/**
 * The access checks of a tour: every crate, and every machine section by its bounding box and mass, against
 * the venue of every engagement, by the access core (src/domain/access). This file only gathers the inputs.
 */

const isKnown = (v: number | null | undefined): v is number => typeof v === 'number' && Number.isFinite(v) && v > 0;

/**
 * The venue's access as the core reads it. The floor rating is the lower of the route's and the stage's;
 * when either is not known the rating is unknown, so the floor check says so rather than trusting one.
 */
export function venueForCore(access: VenueAccessData | null | undefined): AccessVenue {
  const a = access ?? { doors: [] };
  const route = a.floorRatingKnPerM2;
  const stage = a.stageFloorRatingKnPerM2;
  return {
    doors: a.doors ?? [],
    lift: a.lift ?? null,
    floorRatingKnPerM2: isKnown(route) && isKnown(stage) ? Math.min(route, stage) : null,
    handlingEquipmentKg: a.handlingEquipmentKg,
    dock: a.dock ?? undefined,
    ramps: a.ramps ?? undefined,
    equipment: a.equipment ?? undefined,
    pointLoadRatingKn: a.pointLoadRatingKn ?? undefined,
    pointLoadAreaSideMm: a.pointLoadAreaSideMm ?? undefined,
  };
}

type AccessVehicle = NonNullable<AccessOptions['vehicle']>;

/** A delivering vehicle's bed height and tail lift, for the dock check. */
export function accessVehicle(vehicle: VehicleRow): AccessVehicle {
  const spec = vehicle.spec ?? {};
  return { bedHeightMm: spec.bedHeightMm, tailLiftCapacityKg: spec.tailLiftCapacityKg ?? null };
}

export function crateRow(c: TourCrateView): MatrixRowView {
  return { id: c.id, kind: 'crate', code: c.code, name: c.name, lengthMm: c.lengthMm, widthMm: c.widthMm, heightMm: c.heightMm, grossKg: c.grossKg, mayTilt: c.mayTilt };
}

/**
 * Machine sections as they would travel uncrated: their bounding box (x length, y width, z height, as
 * built) and their mass. The mass is the weighed one where a weighing exists, else the computed mass with
 * margin; while the breakdown has gaps it is only a lower bound, so it is given as unknown. Sections are
 * never assumed to tilt.
 */
export async function sectionRows(db: Knex, productionId: string): Promise<MatrixRowView[]> {
  const sections = await db('machine_sections').where({ production_id: productionId }).orderBy(['sort_order', 'code']).select('id', 'code', 'name');
  if (sections.length === 0) return [];
  const mass = await machineMass(db, productionId);
  return sections.map((s) => {
    const m = mass.sections[s.id];
    const box = m?.bboxMm;
    const size = box ? [0, 1, 2].map((i) => box.maxMm[i] - box.minMm[i]) : null;
    const weighed = m?.weighing?.massKg;
    let grossKg: number | null = null;
    let note: string | undefined;
    if (typeof weighed === 'number' && weighed > 0) {
      grossKg = weighed;
      note = 'weighed mass';
    } else if (m && m.complete && m.massWithMarginKg > 0) {
      grossKg = m.massWithMarginKg;
      note = `computed mass with ${m.marginPercent} % margin`;
    } else {
      note = m ? `mass incomplete: ${m.gaps.length} gap${m.gaps.length === 1 ? '' : 's'} in the breakdown` : 'no mass computed';
    }
    if (!size || size.some((v) => !(v > 0))) note = `${note}; size unknown (no bounding box)`;
    return {
      id: s.id,
      kind: 'section' as const,
      code: s.code,
      name: s.name,
      lengthMm: size && size[0] > 0 ? size[0] : null,
      widthMm: size && size[1] > 0 ? size[1] : null,
      heightMm: size && size[2] > 0 ? size[2] : null,
      grossKg,
      mayTilt: false,
      note,
    };
  });
}

/** A row as the core's crate: an unknown size goes in as NaN, which the core reports as "not checked". */
export function rowForCore(r: MatrixRowView): MatrixCrate {
  return { id: r.id, name: r.code, lengthMm: r.lengthMm ?? NaN, widthMm: r.widthMm ?? NaN, heightMm: r.heightMm ?? NaN, grossKg: r.grossKg, mayTilt: r.mayTilt };
}

export interface MatrixInputs {
  rows: MatrixRowView[];
  columns: (MatrixColumnView & { venue: MatrixVenue })[];
}

/**
 * Rows (crates, then sections) and columns (engagements in tour order, each with its venue's access and the
 * vehicles of the leg that delivers there: each crate's own, or all of them for a crate not yet placed).
 */
export async function matrixInputs(
  db: Knex,
  productionId: string,
  opts: { sections?: boolean; engagementIds?: string[]; /** Already read by the caller: not read again. */ crates?: TourCrateView[]; legs?: LegView[] } = {},
): Promise<MatrixInputs> {
  const [engagementRows, crates, legs, vehicles, sections] = await Promise.all([
    engagementsQuery(db, productionId),
    opts.crates ?? loadCrates(db, productionId),
    opts.legs ?? loadLegs(db, productionId),
    loadVehicles(db, productionId),
    opts.sections === false ? Promise.resolve([]) : sectionRows(db, productionId),
  ]);
  const venueIds = [...new Set(engagementRows.filter((e) => !opts.engagementIds || opts.engagementIds.includes(e.id)).map((e) => e.venue_id))];
  const venues = (await db<VenueRow>('venues').whereIn('id', venueIds.length ? venueIds : ['00000000-0000-0000-0000-000000000000'])) as VenueRow[];
  const columns = engagementRows
    .filter((e) => !opts.engagementIds || opts.engagementIds.includes(e.id))
    .map((row) => {
      const e = toEngagementView(row);
      const venue = venues.find((v) => v.id === e.venueId);
      const leg = legs.find((l) => l.toEngagementId === e.id);
      const legVehicles = (leg?.vehicles ?? []).map((lv) => vehicles.find((v) => v.id === lv.id)).filter((v): v is VehicleRow => Boolean(v));
      // Each crate is checked with the vehicle the leg puts it on; one not placed yet against each of the
      // leg's vehicles, the worst result kept (sections, which travel in crates, likewise).
      const crateVehicles: Record<string, AccessVehicle> = {};
      for (const c of leg?.crates ?? []) {
        const v = c.vehicleId ? legVehicles.find((x) => x.id === c.vehicleId) : undefined;
        if (v) crateVehicles[c.crateId] = accessVehicle(v);
      }
      return {
        venueId: e.venueId,
        engagementId: e.id,
        venueName: e.venueName,
        city: e.venueCity,
        loadInOn: e.loadInOn,
        vehicleName: legVehicles.length ? legVehicles.map((v) => v.name).join(', ') : null,
        venue: { id: e.id, name: e.venueName, access: venueForCore(venue?.access), crateVehicles, vehicles: legVehicles.map(accessVehicle) },
      };
    });
  return { rows: [...crates.map(crateRow), ...sections], columns };
}

/** Runs the core's tour matrix on the inputs. */
export function runMatrix(inputs: MatrixInputs): AccessMatrixView {
  const m = accessMatrix(
    inputs.rows.map(rowForCore),
    inputs.columns.map((c) => c.venue),
  );
  const counts = { pass: 0, fail: 0, unknown: 0 };
  for (const c of m.cells) counts[c.verdict]++;
  return {
    rows: inputs.rows,
    columns: inputs.columns.map(({ venue: _v, ...c }) => c),
    cells: m.cells.map((c) => ({ rowId: c.crateId, engagementId: c.venueId, verdict: c.verdict, findings: c.findings, tightestText: c.tightestText })),
    verdict: m.verdict,
    counts,
  };
}

export async function tourMatrix(db: Knex, productionId: string): Promise<AccessMatrixView> {
  return runMatrix(await matrixInputs(db, productionId));
}
