import type { Knex } from 'knex';
import type { VenueAccessData, VenueContact } from '../../../src/domain/contracts/tour.ts';

/**
 * The demo tour of Orrery Seven (SCENARIO.md): eight engagements over ten weeks, each venue's access data
 * chosen to exercise one check, contacts, the legs between them with the production's vehicles, and a first
 * check-in at Kelderwerf Hall with one damaged crate and one missing. Every figure is invented; the rows are
 * written only into an empty database, inside the seed's transaction.
 *
 * Runs after the crates and vehicles are seeded: every crate travels on every leg.
 */
interface DemoVenue {
  name: string;
  access: VenueAccessData;
  contacts: Partial<VenueContact>[];
  address: string;
  paperworkUnits?: 'metric' | 'imperial';
  dates: [string, string, string, string];
  /** The vehicle codes of the leg arriving here; the leg leaves on `departsOn`. */
  leg: { vehicles: string[]; departsOn: string; notes?: string };
}

const INCH_MM = 25.4;

const DEMO: DemoVenue[] = [
  {
    name: 'Kelderwerf Hall',
    address: 'Kadeweg 14, Rotterdam',
    // Street-level doors, no dock: the crates come off the semi-trailer by tail lift or forklift, and there is neither.
    access: {
      doors: [
        { name: 'street doors', widthMm: 2400, heightMm: 2700 },
        { name: 'stage door', widthMm: 2000, heightMm: 2400 },
      ],
      dock: { kind: 'street' },
      floorRatingKnPerM2: 10,
      stageFloorRatingKnPerM2: 7.5,
      handlingEquipmentKg: 70,
      equipment: [{ kind: 'hand-pallet-truck', capacityKg: 2000 }],
    },
    contacts: [{ name: 'Femke Draaijer', role: 'technical manager', email: 'tech@kelderwerf-hall.example', phone: '+31 10 555 0140' }],
    dates: ['2027-03-01', '2027-03-02', '2027-03-04', '2027-03-05'],
    leg: { vehicles: ['TR1'], departsOn: '2027-02-26', notes: 'From the workshop.' },
  },
  {
    name: 'Sala Ventolina',
    address: 'Carrer del Vent 7, Barcelona',
    // A 1,100 mm corridor door on the way to the stage.
    access: {
      doors: [
        { name: 'loading door', widthMm: 2500, heightMm: 3000 },
        { name: 'corridor door B2', widthMm: 1100, heightMm: 2100 },
        { name: 'stage door', widthMm: 2000, heightMm: 2400 },
      ],
      dock: { kind: 'dock', heightMm: 1200, levellerRangeMm: 150 },
      floorRatingKnPerM2: 7.5,
      stageFloorRatingKnPerM2: 7.5,
      handlingEquipmentKg: 120,
      equipment: [{ kind: 'electric-pallet-truck', capacityKg: 2000 }],
    },
    contacts: [{ name: 'Núria Castellví', role: 'head of stage', email: 'escenari@sala-ventolina.example', phone: '+34 93 555 0112' }],
    dates: ['2027-03-09', '2027-03-10', '2027-03-12', '2027-03-13'],
    leg: { vehicles: ['TR1'], departsOn: '2027-03-05' },
  },
  {
    name: 'Havsljus Scen',
    address: 'Hamnkajen 3, Gothenburg',
    // A freight lift rated 2,000 kg of unknown loading class (taken as class A); the stage rating not given yet.
    access: {
      doors: [{ name: 'dock door', widthMm: 2400, heightMm: 2800 }],
      lift: { name: 'freight lift', carLengthMm: 2600, carWidthMm: 1600, carHeightMm: 2300, doorWidthMm: 1500, doorHeightMm: 2200, ratedLoadKg: 2000, loadingClass: null },
      dock: { kind: 'dock', heightMm: 1200, levellerRangeMm: 100 },
      floorRatingKnPerM2: 5,
      stageFloorRatingKnPerM2: null,
      handlingEquipmentKg: 120,
      equipment: [{ kind: 'electric-pallet-truck', capacityKg: 1500 }],
    },
    contacts: [{ name: 'Linnea Bergqvist', role: 'production manager', email: 'produktion@havsljus-scen.example', phone: '+46 31 555 0190' }],
    dates: ['2027-03-18', '2027-03-19', '2027-03-21', '2027-03-22'],
    leg: { vehicles: ['TR1'], departsOn: '2027-03-13' },
  },
  {
    name: 'Teatr Bursztynowy',
    address: 'ul. Bursztynowa 21, Gdańsk',
    // The stage is rated 5.0 kN/m²: the heaviest crate needs spreader plates.
    access: {
      doors: [
        { name: 'scene dock door', widthMm: 2200, heightMm: 2600 },
        { name: 'stage entrance', widthMm: 2400, heightMm: 3200 },
      ],
      dock: { kind: 'dock', heightMm: 1100, levellerRangeMm: 200 },
      floorRatingKnPerM2: 7.5,
      stageFloorRatingKnPerM2: 5,
      handlingEquipmentKg: 70,
      equipment: [{ kind: 'hand-pallet-truck', capacityKg: 2500 }],
    },
    contacts: [{ name: 'Bartosz Wielgus', role: 'stage manager', email: 'scena@teatr-bursztynowy.example', phone: '+48 58 555 0177' }],
    dates: ['2027-03-26', '2027-03-27', '2027-03-29', '2027-03-30'],
    leg: { vehicles: ['TR1'], departsOn: '2027-03-22' },
  },
  {
    name: 'Loomworks Hall',
    address: 'Weavers Yard, Manchester',
    // A 1.2 m loading dock, a forklift on site; its 500 kg hanging points are kept by the lifting module.
    access: {
      doors: [
        { name: 'dock door', widthMm: 3000, heightMm: 3500 },
        { name: 'scene dock', widthMm: 2500, heightMm: 4000 },
      ],
      dock: { kind: 'dock', heightMm: 1200, levellerRangeMm: 150 },
      floorRatingKnPerM2: 10,
      stageFloorRatingKnPerM2: 10,
      handlingEquipmentKg: 70,
      equipment: [
        { kind: 'gas-forklift', capacityKg: 2500 },
        { kind: 'hand-pallet-truck', capacityKg: 2000 },
      ],
    },
    contacts: [
      { name: 'Dale Whitcombe', role: 'production manager', email: 'venue@ballast.example', phone: '+44 161 555 0123' },
      { name: 'Priya Ashworth', role: 'dock supervisor', email: 'dock@loomworks-hall.example', phone: '+44 161 555 0124' },
    ],
    dates: ['2027-04-05', '2027-04-06', '2027-04-08', '2027-04-09'],
    leg: { vehicles: ['TR1'], departsOn: '2027-03-31', notes: 'Ferry Rotterdam – Hull.' },
  },
  {
    name: 'Forum Aurelian',
    address: '4 quai des Tisserands, Lyon',
    // A 9 % ramp from the dock to the stage: a hand pallet truck (3 %) cannot take it.
    access: {
      doors: [{ name: 'loading door', widthMm: 2400, heightMm: 2800 }],
      dock: { kind: 'dock', heightMm: 1200, levellerRangeMm: 150 },
      ramps: [{ name: 'ramp to the stage', gradientPct: 9 }],
      floorRatingKnPerM2: 7.5,
      stageFloorRatingKnPerM2: 7.5,
      handlingEquipmentKg: 70,
      equipment: [{ kind: 'hand-pallet-truck', capacityKg: 2000 }],
    },
    contacts: [{ name: 'Mathilde Rouvière', role: 'régisseuse générale', email: 'regie@forum-aurelian.example', phone: '+33 4 55 50 01 30' }],
    dates: ['2027-04-14', '2027-04-15', '2027-04-17', '2027-04-18'],
    leg: { vehicles: ['TR1'], departsOn: '2027-04-10' },
  },
  {
    name: 'Assay House',
    address: '88 Refinery Lane, Toronto',
    // A 48 in dock; paperwork in imperial units.
    access: {
      doors: [{ name: 'dock door', widthMm: 96 * INCH_MM, heightMm: 120 * INCH_MM }],
      dock: { kind: 'dock', heightMm: 48 * INCH_MM, levellerRangeMm: 6 * INCH_MM },
      floorRatingKnPerM2: 6,
      stageFloorRatingKnPerM2: 7.2,
      handlingEquipmentKg: 120,
      equipment: [{ kind: 'electric-lift-truck', capacityKg: 2000 }],
    },
    paperworkUnits: 'imperial',
    contacts: [{ name: 'Marcus Okafor', role: 'technical director', email: 'td@assay-house.example', phone: '+1 416 555 0150' }],
    dates: ['2027-04-28', '2027-04-29', '2027-05-01', '2027-05-02'],
    leg: { vehicles: ['C40'], departsOn: '2027-04-19', notes: "By sea in the 40' high cube; trucked from the port." },
  },
  {
    name: 'Verrière Pavilion',
    address: '12 rue de la Verrière, Montréal',
    // The 40' high cube is delivered straight to the pavilion door; the venue's forklift unloads it.
    access: {
      doors: [{ name: 'pavilion doors', widthMm: 2600, heightMm: 3000 }],
      dock: { kind: 'street' },
      floorRatingKnPerM2: 7.5,
      stageFloorRatingKnPerM2: 10,
      handlingEquipmentKg: 70,
      equipment: [
        { kind: 'gas-forklift', capacityKg: 3000 },
        { kind: 'hand-pallet-truck', capacityKg: 2000 },
      ],
    },
    contacts: [{ name: 'Élodie Gagnon', role: 'directrice de production', email: 'production@verriere-pavilion.example', phone: '+1 514 555 0166' }],
    dates: ['2027-05-06', '2027-05-07', '2027-05-09', '2027-05-10'],
    leg: { vehicles: ['C40'], departsOn: '2027-05-03', notes: 'Container by road, straight to the door.' },
  },
];

export async function seedDemoTour(trx: Knex, productionId: string): Promise<void> {
  const venues = new Map<string, string>((await trx('venues').where({ production_id: productionId }).select('id', 'name')).map((v: { id: string; name: string }) => [v.name, v.id]));
  const vehicles = new Map<string, string>((await trx('vehicles').where({ production_id: productionId }).select('id', 'code')).map((v: { id: string; code: string }) => [v.code, v.id]));
  const crateIds: string[] = await trx('crates').where({ production_id: productionId }).orderBy('code').pluck('id');

  let previous: string | null = null;
  const engagementIds: string[] = [];
  for (const [i, d] of DEMO.entries()) {
    const venueId = venues.get(d.name);
    if (!venueId) continue;
    await trx('venues')
      .where({ id: venueId })
      .update({
        access: JSON.stringify(d.access),
        contacts: JSON.stringify(d.contacts.map((c) => ({ role: '', email: '', phone: '', receivesManifest: true, ...c }))),
        address: d.address,
        paperwork_units: d.paperworkUnits ?? null,
      });
    const [e] = await trx('engagements')
      .insert({ production_id: productionId, venue_id: venueId, sort_order: i, load_in_on: d.dates[0], show_first_on: d.dates[1], show_last_on: d.dates[2], load_out_on: d.dates[3] })
      .returning('id');
    engagementIds.push(e.id);
    const [leg] = await trx('tour_legs')
      .insert({ production_id: productionId, from_engagement_id: previous, to_engagement_id: e.id, departs_on: d.leg.departsOn, notes: d.leg.notes ?? '' })
      .returning('id');
    const legVehicles = d.leg.vehicles.map((code) => vehicles.get(code)).filter((v): v is string => Boolean(v));
    if (legVehicles.length) await trx('leg_vehicles').insert(legVehicles.map((v, k) => ({ leg_id: leg.id, vehicle_id: v, sort_order: k })));
    if (crateIds.length) await trx('leg_crates').insert(crateIds.map((c, k) => ({ leg_id: leg.id, crate_id: c, vehicle_id: legVehicles[0] ?? null, load_order: k })));
    previous = e.id;
  }

  // Kelderwerf's check-in: everything arrived, one crate damaged, the last planet case missing (flagged
  // before the leg to Sala Ventolina leaves).
  const first = engagementIds[0];
  const planner = await trx('users').where({ email: 'planner@ballast.example' }).first('id');
  if (first && planner && crateIds.length >= 2) {
    const codes = new Map<string, string>((await trx('crates').whereIn('id', crateIds).select('id', 'code')).map((c: { id: string; code: string }) => [c.id, c.code]));
    const missing = crateIds[crateIds.length - 2];
    const damaged = crateIds.find((id) => codes.get(id) === 'AC') ?? crateIds[0];
    await trx('crate_scans').insert(
      crateIds.map((c, k) => ({
        production_id: productionId,
        engagement_id: first,
        crate_id: c,
        direction: 'in',
        state: c === missing ? 'missing' : c === damaged ? 'damaged' : 'arrived',
        method: k % 3 === 0 ? 'list' : 'qr',
        note: c === damaged ? 'Corner post split at the lid; contents look undamaged.' : '',
        idempotency_key: `demo-kelderwerf-in-${k}`,
        scanned_by: planner.id,
        scanned_at: `2027-03-01T${String(8 + Math.floor(k / 6)).padStart(2, '0')}:${String((k * 7) % 60).padStart(2, '0')}:00Z`,
      })),
    );
  }
}
