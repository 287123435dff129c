import type { Request } from 'express';
import type { Knex } from 'knex';
import {
  createPackingRunBody,
  createVehicleBody,
  loadSettingsBody,
  updatePlacementsBody,
  updateVehicleBody,
  type PackingRunView,
  type PlacementView,
  type RunItemView,
  type VehicleView,
} from '../../../src/domain/contracts/crate-loads.ts';
import { validatePacking } from '../../../src/domain/packing/index.ts';
import { AIR_PALLET_MAIN_DECK, EU_SEMI_TRAILER, RIGID_TRUCK_18T, containerVehicle, vehicleProblems, type Vehicle } from '../../../src/domain/vehicles/index.ts';
import { can, route, uuidParam, type RouteDef } from '../../http/routes.ts';
import { invalid, notFound } from '../../http/errors.ts';
import { updateVersioned } from '../../http/versioned.ts';
import type { AppDeps } from '../../app.ts';
import { enqueueJob } from '../../jobs/queue.ts';
import { jobRunnerFor } from '../../jobs/runner.ts';
import { progressTo, runOnWorker } from '../../jobs/worker-thread.ts';
import { ensureLoadSettings, loadCrates, toCrateView, toLoadSettingsView, type LoadSettingsRow } from '../crates/crates.repository.ts';
import { packItem, runFigures, type RunVehicle } from './run-figures.ts';

/** Vehicles and containers the planner can start from (src/domain/vehicles). */
export const VEHICLE_CATALOGUE: readonly Vehicle[] = [containerVehicle('20GP'), containerVehicle('40GP'), containerVehicle('40HC'), EU_SEMI_TRAILER, RIGID_TRUCK_18T, AIR_PALLET_MAIN_DECK];

const PACKING_JOB = 'packing-run';

interface VehicleRow {
  id: string;
  production_id: string;
  code: string;
  name: string;
  kind: string;
  catalogue_id: string | null;
  spec: Vehicle;
  notes: string;
  version: number;
}
interface RunRow {
  id: string;
  production_id: string;
  name: string;
  leg_id: string | null;
  job_id: string | null;
  status: PackingRunView['status'];
  progress: number;
  best_utilisation: number | null;
  input: NonNullable<PackingRunView['input']> & { settings: { airDivisorCm3PerKg: number; roadKgPerLoadingMetre: number } };
  result: PackingRunView['result'];
  figures: PackingRunView['figures'];
  error: string | null;
  started_at: Date | null;
  finished_at: Date | null;
  created_at: Date;
  version: number;
}

const toVehicleView = (r: VehicleRow): VehicleView => ({ id: r.id, code: r.code, name: r.name, kind: r.kind, catalogueId: r.catalogue_id, spec: { ...r.spec, id: r.id }, notes: r.notes, version: r.version });
const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);
function toRunView(r: RunRow, full: boolean): PackingRunView {
  return {
    id: r.id,
    name: r.name,
    legId: r.leg_id,
    status: r.status,
    progress: Number(r.progress),
    bestUtilisation: r.best_utilisation,
    error: r.error,
    createdAt: iso(r.created_at)!,
    startedAt: iso(r.started_at),
    finishedAt: iso(r.finished_at),
    version: r.version,
    ...(full ? { input: { vehicles: r.input.vehicles, items: r.input.items, options: r.input.options }, result: r.result, figures: r.figures } : { figures: r.figures }),
  };
}

function vehicleSpecProblems(spec: Vehicle): void {
  const problems = vehicleProblems(spec);
  if (problems.length > 0) throw invalid(problems.join(' '), problems.map((m) => ({ path: 'spec', message: m })));
}

/**
 * Vehicles, load settings and packing runs of one production, under `/api/productions/:productionId/loads`.
 * A packing run is saved at once and packed by a job (server/jobs) on a worker thread; the client polls
 * the run for its progress and result.
 */
export function loadRoutes(deps: AppDeps): RouteDef[] {
  const { db, log } = deps;
  const pid = (req: Request) => uuidParam(req, 'productionId');
  const runner = jobRunnerFor(db, log);

  runner.register(
    PACKING_JOB,
    async (job, ctx) => {
      const runId = String(job.payload.runId);
      const run = await db<RunRow>('packing_runs').where({ id: runId }).first();
      if (!run) return; // deleted meanwhile
      await db('packing_runs').where({ id: runId }).update({ status: 'running', started_at: db.fn.now(), error: null, updated_at: db.fn.now() });
      const out = await runOnWorker<{ result: NonNullable<RunRow['result']>; figures: NonNullable<RunRow['figures']> }>(
        new URL('./pack.worker.ts', import.meta.url),
        { vehicles: run.input.vehicles, items: run.input.items, options: run.input.options, settings: run.input.settings },
        progressTo(ctx, (progress, msg) =>
          db('packing_runs')
            .where({ id: runId, status: 'running' })
            .update({ progress, best_utilisation: Number(msg.best) })
            .catch((err: unknown) => log.warn({ err }, 'packing progress not saved')),
        ),
        run.input.options.timeLimitMs + 120_000,
      );
      await db('packing_runs')
        .where({ id: runId })
        .update({ status: 'done', progress: 1, result: JSON.stringify(out.result), figures: JSON.stringify(out.figures), finished_at: db.fn.now(), updated_at: db.fn.now() });
    },
    async (job, err, status) => {
      await db('packing_runs')
        .where({ id: String(job.payload.runId) })
        .update(status === 'failed' ? { status: 'failed', error: err.message, finished_at: db.fn.now() } : { status: 'queued', error: `Retrying: ${err.message}` });
    },
  );

  async function runRow(dbx: Knex, productionId: string, runId: string): Promise<RunRow> {
    const r = await dbx<RunRow>('packing_runs').where({ id: runId, production_id: productionId }).first();
    if (!r) throw notFound('The packing run');
    return r;
  }

  return [
    // ----------------------------------------------------------------------------------- vehicles
    route({ method: 'get', path: '/vehicle-catalogue', access: can('crate.read'), handler: () => ({ vehicles: VEHICLE_CATALOGUE }) }),
    route({
      method: 'get',
      path: '/vehicles',
      access: can('crate.read'),
      handler: async (req) => ({ vehicles: (await db<VehicleRow>('vehicles').where({ production_id: pid(req) }).orderBy('code')).map(toVehicleView) }),
    }),
    route({
      method: 'post',
      path: '/vehicles',
      access: can('crate.edit'),
      body: createVehicleBody,
      async handler(req, res) {
        const productionId = pid(req);
        const b = req.body as ReturnType<typeof createVehicleBody.parse>;
        let spec: Vehicle;
        if (b.catalogueId) {
          const c = VEHICLE_CATALOGUE.find((v) => v.id === b.catalogueId);
          if (!c) throw invalid(`Vehicle "${b.catalogueId}" is not in the catalogue.`, [{ path: 'catalogueId', message: `Unknown catalogue entry "${b.catalogueId}".` }]);
          spec = structuredClone(c) as Vehicle;
        } else {
          spec = b.spec as Vehicle;
          vehicleSpecProblems(spec);
        }
        try {
          const [row] = await db<VehicleRow>('vehicles')
            .insert({ production_id: productionId, code: b.code, name: b.name || spec.name, kind: spec.kind, catalogue_id: b.catalogueId ?? null, spec: JSON.stringify(spec) as never, notes: b.notes ?? '' })
            .returning('*');
          res.status(201);
          return { vehicle: toVehicleView(row) };
        } catch (e) {
          if ((e as { code?: string }).code === '23505') throw invalid(`A vehicle with code "${b.code}" already exists.`, [{ path: 'code', message: `Code "${b.code}" is taken.` }]);
          throw e;
        }
      },
    }),
    route({
      method: 'patch',
      path: '/vehicles/:vehicleId',
      access: can('crate.edit'),
      body: updateVehicleBody,
      async handler(req) {
        const b = req.body as ReturnType<typeof updateVehicleBody.parse>;
        const changes: Record<string, unknown> = {};
        if (b.code !== undefined) changes.code = b.code;
        if (b.name !== undefined) changes.name = b.name;
        if (b.notes !== undefined) changes.notes = b.notes;
        if (b.spec) {
          vehicleSpecProblems(b.spec as Vehicle);
          changes.spec = JSON.stringify(b.spec);
          changes.kind = b.spec.kind;
        }
        const row = await updateVersioned<VehicleRow>(db, 'vehicles', { id: uuidParam(req, 'vehicleId'), production_id: pid(req) }, b.version, changes, 'The vehicle', toVehicleView);
        return { vehicle: toVehicleView(row) };
      },
    }),
    route({
      method: 'delete',
      path: '/vehicles/:vehicleId',
      access: can('crate.edit'),
      async handler(req) {
        const n = await db('vehicles').where({ id: uuidParam(req, 'vehicleId'), production_id: pid(req) }).delete();
        if (n === 0) throw notFound('The vehicle');
      },
    }),

    // ----------------------------------------------------------------------------------- settings
    route({ method: 'get', path: '/settings', access: can('crate.read'), handler: async (req) => ({ settings: toLoadSettingsView(await ensureLoadSettings(db, pid(req))) }) }),
    route({
      method: 'patch',
      path: '/settings',
      access: can('crate.edit'),
      body: loadSettingsBody,
      async handler(req) {
        const productionId = pid(req);
        const b = req.body as ReturnType<typeof loadSettingsBody.parse>;
        await ensureLoadSettings(db, productionId);
        const changes: Record<string, unknown> = {};
        if (b.airDivisorCm3PerKg !== undefined) changes.air_divisor_cm3_per_kg = b.airDivisorCm3PerKg;
        if (b.roadKgPerLoadingMetre !== undefined) changes.road_kg_per_loading_metre = b.roadKgPerLoadingMetre;
        if (b.handlingColumn !== undefined) changes.handling_column = b.handlingColumn;
        const row = await updateVersioned<LoadSettingsRow>(db, 'load_settings', { production_id: productionId }, b.version, changes, 'The load settings', toLoadSettingsView);
        return { settings: toLoadSettingsView(row) };
      },
    }),

    // ----------------------------------------------------------------------------------- packing runs
    route({
      method: 'get',
      path: '/runs',
      access: can('crate.read'),
      async handler(req) {
        const rows = await db<RunRow>('packing_runs').where({ production_id: pid(req) }).orderBy('created_at', 'desc').limit(200);
        return { runs: rows.map((r) => toRunView(r, false)) };
      },
    }),
    route({
      method: 'get',
      path: '/runs/:runId',
      access: can('crate.read'),
      handler: async (req) => ({ run: toRunView(await runRow(db, pid(req), uuidParam(req, 'runId')), true) }),
    }),
    route({
      method: 'post',
      path: '/runs',
      access: can('crate.edit'),
      body: createPackingRunBody,
      async handler(req, res) {
        const productionId = pid(req);
        const b = { ...(req.body as ReturnType<typeof createPackingRunBody.parse>) };
        if (b.legId) {
          // A leg of the tour: its vehicles and crates unless given, its unloading order as the stops.
          const leg = await db('tour_legs').where({ id: b.legId, production_id: productionId }).first('id');
          if (!leg) throw invalid('No such leg in this production.', [{ path: 'legId', message: 'Pick a leg of this tour.' }]);
          if (!b.vehicleIds?.length) b.vehicleIds = (await db('leg_vehicles').where({ leg_id: b.legId }).orderBy('sort_order').select('vehicle_id')).map((r: { vehicle_id: string }) => r.vehicle_id);
          if (!b.crates?.length) {
            b.crates = (await db('leg_crates').where({ leg_id: b.legId }).orderBy('load_order').select('crate_id', 'load_order')).map((r: { crate_id: string; load_order: number }) => ({ crateId: r.crate_id, stopIndex: r.load_order }));
          }
          if (!b.vehicleIds.length) throw invalid('The leg has no vehicles yet.', [{ path: 'vehicleIds', message: 'Give the leg its vehicles, or pick them here.' }]);
          if (!b.crates.length) throw invalid('The leg has no crates yet.', [{ path: 'crates', message: 'Give the leg its crates, or pick them here.' }]);
        }
        const vehicleIds = b.vehicleIds!;
        const crateList = b.crates!;
        const vehicleRows = await db<VehicleRow>('vehicles').where({ production_id: productionId }).whereIn('id', vehicleIds);
        const missingV = vehicleIds.filter((id) => !vehicleRows.some((v) => v.id === id));
        if (missingV.length > 0) throw invalid('Some vehicles are not in this production.', missingV.map((id) => ({ path: `vehicleIds.${vehicleIds.indexOf(id)}`, message: `No vehicle ${id}.` })));
        const crateIds = crateList.map((c) => c.crateId);
        if (new Set(crateIds).size !== crateIds.length) throw invalid('A crate is listed twice.', [{ path: 'crates', message: 'List each crate once.' }]);
        const [settingsRow, crates] = await Promise.all([ensureLoadSettings(db, productionId), loadCrates(db, productionId, crateIds)]);
        const settings = toLoadSettingsView(settingsRow);
        const issues: { path: string; message: string }[] = [];
        const items: RunItemView[] = [];
        crateList.forEach((c, i) => {
          const found = crates.find((x) => x.crate.id === c.crateId);
          if (!found) return issues.push({ path: `crates.${i}.crateId`, message: `No crate ${c.crateId} in this production.` });
          const v = toCrateView(found.crate, found.contents, settings);
          if (!v.figures.massComplete) return issues.push({ path: `crates.${i}.crateId`, message: `Crate ${v.code}: its gross mass is not known (a content line has no mass); packing needs every crate's mass.` });
          items.push({
            id: v.id,
            code: v.code,
            lengthMm: v.outerMm[0],
            widthMm: v.outerMm[1],
            heightMm: v.outerMm[2],
            massKg: v.figures.grossKg,
            quantity: 1,
            // A crate marked "this way up", or one that may not be tilted, keeps its height vertical.
            orientation: !v.thisWayUp && v.mayTilt ? 'any' : 'upright',
            stackable: v.stackable,
            ...(v.stackable && v.maxLoadOnTopKg !== null ? { maxLoadOnTopKg: v.maxLoadOnTopKg } : {}),
            ...(c.stopIndex !== undefined ? { stopIndex: c.stopIndex } : {}),
            cogMm: v.figures.cogMm,
          });
        });
        if (issues.length > 0) throw invalid('Some crates cannot be packed.', issues);
        // Keep the vehicles in the order the planner gave: the engine fills them in that order.
        const vehicles: RunVehicle[] = vehicleIds.map((id) => {
          const r = vehicleRows.find((v) => v.id === id)!;
          return { ...r.spec, id: r.id, name: r.name, code: r.code, vehicleRowId: r.id };
        });
        const input = {
          vehicles,
          items,
          options: { timeLimitMs: b.timeLimitMs, fullSupport: b.fullSupport, seed: b.seed },
          settings: { airDivisorCm3PerKg: settings.airDivisorCm3PerKg, roadKgPerLoadingMetre: settings.roadKgPerLoadingMetre },
        };
        const row = await db.transaction(async (trx) => {
          const job = await enqueueJob(trx, { kind: PACKING_JOB, productionId, payload: {} });
          const [run] = await trx<RunRow>('packing_runs')
            .insert({ production_id: productionId, name: b.name, leg_id: b.legId ?? null, job_id: job.id, input: JSON.stringify(input) as never, created_by: req.actor!.userId } as never)
            .returning('*');
          await trx('jobs').where({ id: job.id }).update({ payload: JSON.stringify({ runId: run.id }) });
          return run;
        });
        runner.kick();
        res.status(202);
        return { run: toRunView(row, true) };
      },
    }),
    route({
      method: 'patch',
      path: '/runs/:runId/placements',
      access: can('crate.edit'),
      body: updatePlacementsBody,
      async handler(req) {
        const productionId = pid(req);
        const runId = uuidParam(req, 'runId');
        const b = req.body as ReturnType<typeof updatePlacementsBody.parse>;
        const run = await runRow(db, productionId, runId);
        if (run.status !== 'done' || !run.result) throw invalid('The run has no result to edit yet.', [{ path: 'placements', message: 'Wait for the run to finish.' }]);
        const vehicle = run.input.vehicles.find((v) => v.id === b.vehicleId);
        if (!vehicle) throw invalid('That vehicle is not in this run.', [{ path: 'vehicleId', message: `No vehicle ${b.vehicleId} in the run.` }]);
        const items = run.input.items;
        const known = new Set(items.map((i) => i.id));
        const strangers = b.placements.filter((p) => !known.has(p.id));
        if (strangers.length > 0) throw invalid('Some placements name crates that are not in this run.', strangers.map((p) => ({ path: 'placements', message: `Unknown crate "${p.id}".` })));
        const mine: PlacementView[] = b.placements.map((p) => ({ ...p, vehicleId: vehicle.id }));
        // The rules, re-checked by the same validator the engine is tested with.
        const check = validatePacking(vehicle, items.map(packItem), mine, { fullSupport: run.input.options.fullSupport });
        if (!check.ok) {
          throw invalid(
            `The edited load breaks the packing rules: ${check.messages.slice(0, 5).join('; ')}.`,
            check.messages.map((m) => ({ path: 'placements', message: m })),
            'packing_rules',
          );
        }
        // Crates now in this vehicle leave wherever they were; crates taken out of it are not placed.
        const moved = new Set(mine.map((p) => p.id));
        const others = run.result.placements.filter((p) => p.vehicleId !== vehicle.id && !moved.has(p.id));
        const placements = [...others, ...mine];
        const placedIds = new Set(placements.map((p) => p.id));
        const unplaced = items
          .filter((i) => !placedIds.has(i.id))
          .map((i) => run.result!.unplaced.find((u) => u.id === i.id) ?? { id: i.id, quantity: i.quantity, reason: `crate ${i.code}: taken off the load by hand` });
        const result = { placements, unplaced, vehiclesUsed: new Set(placements.map((p) => p.vehicleId)).size, editedByHand: true };
        const figures = runFigures(run.input.vehicles, items, placements, unplaced, run.input.settings, run.input.options.fullSupport);
        const row = await updateVersioned<RunRow>(db, 'packing_runs', { id: runId, production_id: productionId }, b.version, { result: JSON.stringify(result), figures: JSON.stringify(figures) }, 'The packing run', (r) => toRunView(r, true));
        return { run: toRunView(row, true) };
      },
    }),
    route({
      method: 'delete',
      path: '/runs/:runId',
      access: can('crate.edit'),
      async handler(req) {
        const run = await runRow(db, pid(req), uuidParam(req, 'runId'));
        await db.transaction(async (trx) => {
          await trx('packing_runs').where({ id: run.id }).delete();
          if (run.job_id) await trx('jobs').where({ id: run.job_id }).whereIn('status', ['queued', 'done', 'failed']).delete();
        });
      },
    }),
  ];
}
