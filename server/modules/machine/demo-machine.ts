import type { Knex } from 'knex';
import type { MassSource } from '../../../src/domain/contracts/mass.ts';
import { DEFAULT_MATERIALS, weighingFromLoadCells } from '../../../src/domain/mass/index.ts';
import { json } from './machine.repository.ts';

/**
 * The demo machine: Orrery Seven's breakdown (an invented walk-around orrery, 4.2 m across and 3.4 m high),
 * generated deterministically so every database gets the same ~2,500 lines and a reviewer can check a
 * section's mass by hand against the scenario's rough figures (BQ 4 × ~95 kg, DC ~420, AC ~180, PC ~170,
 * CD ~70, TF ~260 with its frames). Frame: origin at the centre of the base on the floor, z up, mm, kg.
 * A few lines are left without mass or position on purpose, so the gaps list has something to show.
 */

/** A small deterministic generator (LCG, Numerical Recipes constants): the same demo every time. */
function rng(seed: number) {
  let s = seed >>> 0;
  const next = () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
  return {
    next,
    between: (a: number, b: number) => a + (b - a) * next(),
    int: (a: number, b: number) => Math.floor(a + (b - a + 1) * next()),
    pick: <T>(xs: readonly T[]) => xs[Math.floor(next() * xs.length)],
  };
}

type Vec3 = [number, number, number];
interface Region {
  /** Cylinder sector: radii, angles (deg, from +x towards +y) and heights, mm. */
  r: [number, number];
  a: [number, number];
  z: [number, number];
}

interface LeafSpec {
  number: string;
  name: string;
  /** Target mass of the leaf's lines, kg. */
  massKg: number;
  made: number;
  bought: number;
  materials: string[];
  region: Region;
}

interface GroupSpec {
  number: string;
  name: string;
  section?: string;
  keepTogether?: boolean;
  leaves: LeafSpec[];
}

const quadrant = (k: number): GroupSpec => {
  const a: [number, number] = [90 * (k - 1) + 2, 90 * k - 2];
  return {
    number: `1${k}0`,
    name: `Base quadrant ${k}`,
    section: `BQ${k}`,
    keepTogether: true,
    leaves: [
      { number: `1${k}1`, name: `Quadrant ${k} steel frame`, massKg: 52, made: 26, bought: 10, materials: ['steel'], region: { r: [1500, 2100], a, z: [0, 180] } },
      { number: `1${k}2`, name: `Quadrant ${k} deck and fascia`, massKg: 33, made: 30, bought: 14, materials: ['plywood-birch', 'mdf'], region: { r: [1480, 2100], a, z: [180, 240] } },
      { number: `1${k}3`, name: `Quadrant ${k} fixings and levellers`, massKg: 10, made: 6, bought: 140, materials: ['steel', 'stainless-304'], region: { r: [1500, 2100], a, z: [0, 240] } },
    ],
  };
};

const ring = (r: [number, number], z: [number, number]): Region => ({ r, a: [0, 360], z });

const GROUPS: GroupSpec[] = [
  quadrant(1),
  quadrant(2),
  quadrant(3),
  quadrant(4),
  {
    number: '200',
    name: 'Drive core',
    section: 'DC',
    keepTogether: true,
    leaves: [
      { number: '210', name: 'Motor and gearbox', massKg: 140, made: 12, bought: 60, materials: ['steel', 'aluminium'], region: ring([0, 450], [0, 700]) },
      { number: '220', name: 'Main shaft', massKg: 96, made: 20, bought: 30, materials: ['steel'], region: ring([0, 120], [200, 2600]) },
      { number: '230', name: 'Bearing housings', massKg: 88, made: 36, bought: 70, materials: ['steel', 'brass'], region: ring([0, 300], [250, 2500]) },
      { number: '240', name: 'Gear train', massKg: 71, made: 120, bought: 90, materials: ['acetal', 'brass', 'steel'], region: ring([0, 520], [700, 1300]) },
    ],
  },
  {
    number: '300',
    name: 'Arm carousel',
    section: 'AC',
    keepTogether: true,
    leaves: [
      { number: '310', name: 'Carousel hub', massKg: 40, made: 40, bought: 80, materials: ['steel', 'aluminium'], region: ring([120, 600], [2400, 2900]) },
      { number: '320', name: 'Arms and braces', massKg: 60, made: 110, bought: 150, materials: ['steel', 'aluminium'], region: ring([600, 2050], [2500, 3300]) },
    ],
  },
  {
    number: '400',
    name: 'Planet carriers and planets',
    section: 'PC',
    leaves: Array.from({ length: 8 }, (_, i) => ({
      number: `4${String(i + 1).padStart(2, '0')}`,
      name: `Planet ${i + 1} and carrier`,
      massKg: [14, 18, 22, 26, 30, 24, 20, 16][i],
      made: 18,
      bought: 12,
      materials: ['brass', 'aluminium', 'acrylic'],
      region: { r: [1700, 2050], a: [i * 45 - 8, i * 45 + 8], z: [2900, 3400] } as Region,
    })),
  },
  {
    number: '500',
    name: 'Control desk and cable looms',
    section: 'CD',
    leaves: [
      { number: '510', name: 'Desk frame and panels', massKg: 34, made: 30, bought: 40, materials: ['aluminium', 'plywood-birch'], region: { r: [2600, 3300], a: [-20, 20], z: [0, 1100] } },
      { number: '520', name: 'Controls and electronics', massKg: 18, made: 8, bought: 120, materials: ['abs', 'polycarbonate', 'copper'], region: { r: [2650, 3250], a: [-15, 15], z: [700, 1100] } },
      { number: '530', name: 'Cable looms', massKg: 18, made: 4, bought: 90, materials: ['copper'], region: { r: [300, 3300], a: [-20, 20], z: [0, 150] } },
    ],
  },
  {
    number: '600',
    name: 'Transport frames, lifting beam, tools and spares',
    section: 'TF',
    leaves: [
      { number: '610', name: 'Lifting beam and rigging kit', massKg: 72, made: 10, bought: 30, materials: ['steel'], region: { r: [4000, 5200], a: [170, 190], z: [0, 600] } },
      { number: '620', name: 'Tool chests', massKg: 58, made: 4, bought: 110, materials: ['steel'], region: { r: [4000, 5200], a: [190, 200], z: [0, 900] } },
      { number: '630', name: 'Spares', massKg: 70, made: 60, bought: 120, materials: ['steel', 'brass', 'acetal'], region: { r: [4000, 5200], a: [160, 170], z: [0, 800] } },
    ],
  },
];

const SECTIONS: { code: string; name: string; marginPercent: number | null; cogUncertaintyMm: number | null }[] = [
  { code: 'BQ1', name: 'Base quadrant 1', marginPercent: null, cogUncertaintyMm: 40 },
  { code: 'BQ2', name: 'Base quadrant 2', marginPercent: null, cogUncertaintyMm: 40 },
  { code: 'BQ3', name: 'Base quadrant 3', marginPercent: null, cogUncertaintyMm: 40 },
  { code: 'BQ4', name: 'Base quadrant 4', marginPercent: null, cogUncertaintyMm: 40 },
  { code: 'DC', name: 'Drive core', marginPercent: 10, cogUncertaintyMm: 60 },
  { code: 'AC', name: 'Arm carousel', marginPercent: null, cogUncertaintyMm: 80 },
  { code: 'PC', name: 'Planet carriers and planets', marginPercent: null, cogUncertaintyMm: null },
  { code: 'CD', name: 'Control desk and cable looms', marginPercent: null, cogUncertaintyMm: 50 },
  { code: 'TF', name: 'Transport frames, lifting beam, tools and spares', marginPercent: null, cogUncertaintyMm: 100 },
];

const BOUGHT_NAMES = ['Hex bolt M8', 'Hex bolt M12', 'Washer M10', 'Nyloc nut M8', 'Deep-groove bearing', 'Cable gland', 'Terminal block', 'Hinge', 'Castor 100 mm', 'Spring pin', 'Circlip', 'Lamp holder', 'Relay', 'Shackle 1 t', 'Connector 4-pole'];
const MADE_NAMES = ['Bracket', 'Plate', 'Spacer', 'Rib', 'Gusset', 'Cover', 'Clamp', 'Bush', 'Stiffener', 'Flange', 'Tie bar', 'Gear blank', 'Fascia panel', 'Mount'];
const COUNTRIES = ['DE', 'IT', 'NL', 'SE', 'CN', 'JP', 'US', 'GB'];

function pointIn(g: ReturnType<typeof rng>, reg: Region): Vec3 {
  const r = g.between(reg.r[0], reg.r[1]);
  const a = (g.between(reg.a[0], reg.a[1]) * Math.PI) / 180;
  return [Math.round(r * Math.cos(a)), Math.round(r * Math.sin(a)), Math.round(g.between(reg.z[0], reg.z[1]))];
}

/** Writes the demo machine of one production (inside the seed's transaction). */
export async function seedDemoMachine(trx: Knex.Transaction, productionId: string, machineName: string): Promise<void> {
  const g = rng(7);
  const [machine] = await trx('machines').insert({ production_id: productionId, name: machineName, margin_percent: 5 }).returning('id');
  await trx('machine_materials').insert(
    DEFAULT_MATERIALS.map((m) => ({ production_id: productionId, code: m.code, name: m.name, density_kg_per_m3: m.densityKgPerM3, source: m.source })),
  );
  const sections = await trx('machine_sections')
    .insert(
      SECTIONS.map((s, i) => ({
        production_id: productionId,
        machine_id: machine.id,
        code: s.code,
        name: s.name,
        margin_percent: s.marginPercent,
        cog_uncertainty_mm: s.cogUncertaintyMm,
        sort_order: i,
      })),
    )
    .returning(['id', 'code']);
  const sectionId = new Map(sections.map((s: { id: string; code: string }) => [s.code, s.id]));

  const [root] = await trx('machine_assemblies')
    .insert({ production_id: productionId, machine_id: machine.id, number: '100', name: 'Base ring', sort_order: 0 })
    .returning('id');
  const lines: Record<string, unknown>[] = [];
  let sort = 0;
  let gapCount = 0;
  for (const [gi, group] of GROUPS.entries()) {
    const parentId = group.number.startsWith('1') ? root.id : null;
    const [grp] = await trx('machine_assemblies')
      .insert({
        production_id: productionId,
        machine_id: machine.id,
        number: group.number,
        name: group.name,
        parent_id: parentId,
        section_id: group.section ? sectionId.get(group.section) : null,
        keep_together: group.keepTogether ?? false,
        sort_order: gi + 1,
      })
      .returning('id');
    for (const [li, leaf] of group.leaves.entries()) {
      const [asm] = await trx('machine_assemblies')
        .insert({ production_id: productionId, machine_id: machine.id, number: leaf.number, name: leaf.name, parent_id: grp.id, sort_order: li })
        .returning('id');
      // Raw masses first (a few heavy made parts, many light bought ones), then scaled to the leaf's target.
      const raw: { made: boolean; qty: number; unit: number }[] = [];
      for (let i = 0; i < leaf.made; i++) raw.push({ made: true, qty: g.next() < 0.8 ? 1 : g.int(2, 4), unit: i < 3 ? g.between(4, 12) : g.between(0.05, 1.2) });
      for (let i = 0; i < leaf.bought; i++) raw.push({ made: false, qty: g.int(1, 24), unit: g.between(0.002, 0.25) });
      const sum = raw.reduce((s, r) => s + r.qty * r.unit, 0);
      const k = leaf.massKg / sum;
      raw.forEach((r, i) => {
        const unit = Math.round(r.unit * k * 1000) / 1000 || 0.001;
        const cog = pointIn(g, leaf.region);
        const material = r.made ? g.pick(leaf.materials) : null;
        const density = DEFAULT_MATERIALS.find((m) => m.code === material)?.densityKgPerM3 ?? 7850;
        // A box of the part's own volume, flattened like a plate or bar.
        const side = Math.cbrt((unit / density) * 1e9);
        const half: Vec3 = [Math.round(side * 0.9) || 1, Math.round(side * 0.6) || 1, Math.round(side * 0.35) || 1];
        const source: MassSource = r.made ? (g.next() < 0.7 ? 'cad' : g.next() < 0.5 ? 'weighed' : 'estimated') : g.next() < 0.85 ? 'catalogue' : 'estimated';
        // Three lines with no mass and two with no position: the demo's gaps.
        const noMass = leaf.number === '240' && i % 97 === 5 && gapCount < 3;
        const noCog = leaf.number === '520' && i % 61 === 7;
        if (noMass) gapCount++;
        lines.push({
          production_id: productionId,
          machine_id: machine.id,
          assembly_id: asm.id,
          part_number: `O7-${leaf.number}-${String(i + 1).padStart(4, '0')}`,
          name: r.made ? `${g.pick(MADE_NAMES)} ${leaf.name.toLowerCase()}` : g.pick(BOUGHT_NAMES),
          quantity: r.qty,
          unit_mass_kg: noMass ? null : unit,
          mass_source: noMass ? null : source,
          material,
          make_or_buy: r.made ? 'made' : 'bought',
          value: r.made ? null : Math.round(g.between(0.2, 40) * 100) / 100,
          currency: r.made ? null : 'EUR',
          country_of_origin: r.made ? 'NL' : g.pick(COUNTRIES),
          cog_mm: noCog ? null : json(cog),
          bbox_mm: noCog ? null : json({ minMm: [cog[0] - half[0], cog[1] - half[1], cog[2] - half[2]], maxMm: [cog[0] + half[0], cog[1] + half[1], cog[2] + half[2]] }),
          sort_order: ++sort,
        });
      });
    }
  }
  for (let i = 0; i < lines.length; i += 500) await trx('machine_part_lines').insert(lines.slice(i, i + 500));

  // The eight arm tubes sit where they are: one line, eight placed instances, 45° apart in plan.
  const armsAsm = await trx('machine_assemblies').where({ production_id: productionId, number: '320' }).first('id');
  const [arms] = await trx('machine_part_lines')
    .insert({
      production_id: productionId,
      machine_id: machine.id,
      assembly_id: armsAsm.id,
      part_number: 'O7-320-ARM',
      name: 'Arm tube 60 × 4, 1.6 m',
      quantity: 8,
      unit_mass_kg: 9.4,
      mass_source: 'cad',
      material: 'steel',
      make_or_buy: 'made',
      country_of_origin: 'NL',
      // In the arm's own frame: along +x from the hub.
      cog_mm: json([800, 0, 0]),
      bbox_mm: json({ minMm: [0, -30, -30], maxMm: [1600, 30, 30] }),
      sort_order: ++sort,
    })
    .returning('id');
  await trx('machine_part_instances').insert(
    Array.from({ length: 8 }, (_, i) => ({ production_id: productionId, part_line_id: arms.id, seq: i, x_mm: 450 * Math.cos((i * Math.PI) / 4), y_mm: 450 * Math.sin((i * Math.PI) / 4), z_mm: 2950, rz_deg: i * 45, ry_deg: 0, rx_deg: 0 })),
  );

  await trx('machine_section_add_ons').insert([
    { production_id: productionId, section_id: sectionId.get('DC'), name: 'Drive core transport cradle', mass_kg: 38, mass_source: 'weighed', cog_mm: json([0, 0, 60]), bbox_mm: json({ minMm: [-500, -500, -80], maxMm: [500, 500, 120] }) },
    { production_id: productionId, section_id: sectionId.get('AC'), name: 'Carousel transport frame', mass_kg: 22, mass_source: 'estimated', cog_mm: json([0, 0, 2500]), bbox_mm: json({ minMm: [-700, -700, 2380], maxMm: [700, 700, 2600] }) },
    { production_id: productionId, section_id: sectionId.get('TF'), name: 'Pallet base', mass_kg: 25, mass_source: 'catalogue', cog_mm: json([-4600, 0, 70]), bbox_mm: json({ minMm: [-5200, -600, 0], maxMm: [-4000, 600, 144] }) },
  ]);

  // Base quadrant 1 on four load cells at its support feet: the weighed figures govern.
  const feet: [number, number][] = [
    [830, 480],
    [1830, 480],
    [1830, 1480],
    [830, 1480],
  ];
  const readings = feet.map((p, i) => ({ positionMm: p, readingKg: [24.1, 25.3, 23.8, 24.9][i] }));
  const derived = weighingFromLoadCells(readings);
  await trx('machine_weighings').insert({
    production_id: productionId,
    section_id: sectionId.get('BQ1'),
    weighed_on: '2027-01-18',
    weighed_by: 'Workshop crew',
    scale: 'Four 250 kg load cells, calibrated 2026-11',
    readings: json(readings),
    mass_kg: derived.massKg,
    cog_plan_mm: json(derived.cogPlanMm),
    derived_notes: json(derived.notes),
  });
}
