import type { Knex } from 'knex';
import { packVehicles } from '../../../src/domain/packing/index.ts';
import { EU_SEMI_TRAILER, containerVehicle, type Vehicle } from '../../../src/domain/vehicles/index.ts';
import type { RunItemView } from '../../../src/domain/contracts/crate-loads.ts';
import { finishRun, packItem, type RunVehicle } from '../loads/run-figures.ts';
import { ensureLoadSettings, loadCrates, toCrateView, toLoadSettingsView } from './crates.repository.ts';
import { designedColumns, sectionForCrate, stockColumns } from './crates.service.ts';

/**
 * Orrery Seven's crates and vehicles (SCENARIO.md): a crate designed around each base quadrant (BQ1–BQ4),
 * the drive core (DC, which may travel on its side: it must tilt through a 1,100 mm door), the arm
 * carousel (AC) and the control desk (CD); the planet carriers (PC) in sixteen stock cases, two per
 * planet, with their part lines; the transport frames and tools (TF) on a EUR pallet. Vehicles: a 13.6 m
 * semi-trailer and a 40' high cube. One finished packing run for the first leg, packed deterministically.
 */
export async function seedDemoCrates(trx: Knex, productionId: string): Promise<void> {
  const sections = new Map((await trx('machine_sections').where({ production_id: productionId }).select('id', 'code')).map((s: { id: string; code: string }) => [s.code, s.id]));
  const designed: { code: string; section: string; thisWayUp?: boolean; mayTilt?: boolean; fragile?: boolean }[] = [
    { code: 'BQ1', section: 'BQ1' },
    { code: 'BQ2', section: 'BQ2' },
    { code: 'BQ3', section: 'BQ3' },
    { code: 'BQ4', section: 'BQ4' },
    { code: 'DC', section: 'DC', thisWayUp: false, mayTilt: true },
    { code: 'AC', section: 'AC', fragile: true },
    { code: 'CD', section: 'CD', fragile: true },
  ];
  for (const d of designed) {
    const sectionId = sections.get(d.section);
    if (!sectionId) continue;
    const section = await sectionForCrate(trx, productionId, sectionId);
    const { columns, content } = designedColumns(section, { fragile: d.fragile, thisWayUp: d.thisWayUp ?? true });
    const [crate] = await trx('crates')
      .insert({ production_id: productionId, code: d.code, name: section.name, kind: 'designed', section_id: sectionId, may_tilt: d.mayTilt ?? false, ...columns })
      .returning('id');
    await trx('crate_contents').insert({ ...content, production_id: productionId, crate_id: crate.id });
  }

  // PC: two stock cases per planet assembly (401–408), the part lines dealt alternately into them.
  const lines = await trx('machine_part_lines as l')
    .join('machine_assemblies as a', 'a.id', 'l.assembly_id')
    .where('l.production_id', productionId)
    .andWhere('a.number', 'like', '4__')
    .orderBy(['a.number', 'l.part_number'])
    .select('l.id', 'l.part_number', 'l.name', 'l.quantity', 'l.unit_mass_kg', 'a.number as assembly');
  const byAssembly = new Map<string, typeof lines>();
  for (const l of lines) byAssembly.set(l.assembly, [...(byAssembly.get(l.assembly) ?? []), l]);
  let n = 0;
  for (const [assembly, group] of byAssembly) {
    for (const half of [0, 1]) {
      n++;
      const code = `PC${String(n).padStart(2, '0')}`;
      const cols = stockColumns({ code, kind: 'stock', stockId: 'case-600x400x400' });
      const [crate] = await trx('crates')
        .insert({ production_id: productionId, code, name: `Planet ${Number(assembly.slice(1))} ${half === 0 ? 'parts A' : 'parts B'}`, kind: 'stock', fragile: true, max_load_on_top_kg: 60, ...cols })
        .returning('id');
      const mine = group.filter((_, i) => i % 2 === half);
      await trx('crate_contents').insert(
        mine.map((l, i) => ({
          production_id: productionId,
          crate_id: crate.id,
          part_line_id: l.id,
          description: `${l.part_number} ${l.name}`.trim(),
          quantity: Number(l.quantity),
          mass_kg: l.unit_mass_kg === null ? null : Number(l.unit_mass_kg) * Number(l.quantity),
          // Foam-packed small parts fill the case: their CoG is taken at its middle.
          cog_mm: JSON.stringify([300, 200, 200]),
          sort_order: i,
        })),
      );
    }
  }

  // TF: on a EUR pallet, loaded to 1,000 mm, the section's mass with its CoG estimated low in the load.
  const tfId = sections.get('TF');
  if (tfId) {
    const tf = await sectionForCrate(trx, productionId, tfId);
    const cols = stockColumns({ code: 'TF', kind: 'pallet', stockId: 'eur-pallet', outerMm: [1200, 800, 1000], stackable: false });
    const [crate] = await trx('crates').insert({ production_id: productionId, code: 'TF', name: 'Transport frames, lifting beam, tools', kind: 'pallet', section_id: tfId, max_load_on_top_kg: 0, ...cols }).returning('id');
    await trx('crate_contents').insert({
      production_id: productionId,
      crate_id: crate.id,
      section_id: tfId,
      description: `Section TF — ${tf.name} (${tf.massSource}), strapped to the pallet`,
      quantity: 1,
      mass_kg: tf.massKg,
      cog_mm: JSON.stringify([600, 400, 420]),
    });
  }

  const vehicles: { code: string; spec: Vehicle; catalogueId: string }[] = [
    { code: 'TR1', spec: EU_SEMI_TRAILER, catalogueId: EU_SEMI_TRAILER.id },
    { code: 'C40', spec: containerVehicle('40HC'), catalogueId: containerVehicle('40HC').id },
  ];
  const vrows = await trx('vehicles')
    .insert(vehicles.map((v) => ({ production_id: productionId, code: v.code, name: v.spec.name, kind: v.spec.kind, catalogue_id: v.catalogueId, spec: JSON.stringify(v.spec) })))
    .returning(['id', 'code', 'name', 'spec']);

  // The first leg, Rotterdam → Barcelona, in the semi-trailer: a fixed number of iterations, so every
  // demo database holds the same plan.
  const settings = toLoadSettingsView(await ensureLoadSettings(trx, productionId));
  const crates = (await loadCrates(trx, productionId)).map((c) => toCrateView(c.crate, c.contents, settings)).filter((c) => c.figures.massComplete);
  const items: RunItemView[] = crates.map((v) => ({
    id: v.id,
    code: v.code,
    lengthMm: v.outerMm[0],
    widthMm: v.outerMm[1],
    heightMm: v.outerMm[2],
    massKg: v.figures.grossKg,
    quantity: 1,
    orientation: !v.thisWayUp && v.mayTilt ? 'any' : 'upright',
    stackable: v.stackable,
    ...(v.stackable && v.maxLoadOnTopKg !== null ? { maxLoadOnTopKg: v.maxLoadOnTopKg } : {}),
    cogMm: v.figures.cogMm,
  }));
  const tr = vrows.find((v: { code: string }) => v.code === 'TR1')!;
  const runVehicles: RunVehicle[] = [{ ...tr.spec, id: tr.id, name: tr.name, code: tr.code, vehicleRowId: tr.id }];
  const options = { timeLimitMs: 60_000, fullSupport: true, seed: 1 };
  const packed = await packVehicles(runVehicles, items.map(packItem), { maxIterations: 200, timeLimitMs: options.timeLimitMs, fullSupport: true, seed: 1 });
  const runSettings = { airDivisorCm3PerKg: settings.airDivisorCm3PerKg, roadKgPerLoadingMetre: settings.roadKgPerLoadingMetre };
  const { result, figures } = finishRun(runVehicles, items, packed, runSettings, true);
  await trx('packing_runs').insert({
    production_id: productionId,
    name: 'Leg 1 — Rotterdam to Barcelona, semi-trailer',
    status: 'done',
    progress: 1,
    best_utilisation: figures.vehicles[0]?.volumeUtilisation ?? 0,
    input: JSON.stringify({ vehicles: runVehicles, items, options, settings: runSettings }),
    result: JSON.stringify(result),
    figures: JSON.stringify(figures),
    started_at: trx.fn.now(),
    finished_at: trx.fn.now(),
  });
}
