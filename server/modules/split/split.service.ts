import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { AdoptSplitBody, SectionUnitBody, SplitLimitsQuery, SplitLimitsView, SplitRunView, StartSplitRunBody } from '../../../src/domain/contracts/split.ts';
import { checkSplit, type SplitLimits, type SplitResult } from '../../../src/domain/split/index.ts';
import { AppError, invalid, notFound } from '../../http/errors.ts';
import { enqueueJob } from '../../jobs/queue.ts';
import { jobRunnerFor, type JobRunner } from '../../jobs/runner.ts';
import { progressTo, runOnWorker } from '../../jobs/worker-thread.ts';
import { ensureMachine, type AssemblyRow, type SectionRow } from '../machine/machine.repository.ts';
import { LOOSE_ASSEMBLY_ID, loadSplitSource, type SplitSource } from './split-input.ts';
import { splitLimits } from './split-limits.ts';

/**
 * Split advisor runs (a job on a worker thread, with progress) and adoption of a split (one transaction,
 * against the breakdown's state: a change since answers 409).
 */

export const SPLIT_JOB = 'split-advisor';

interface RunRow {
  id: string;
  production_id: string;
  status: SplitRunView['status'];
  progress: number;
  limits: SplitLimitsView;
  input: SplitSource['core'] & { numbers: Record<string, string> };
  options: { seed: number; timeLimitMs: number; maxProposals: number };
  stamp: string;
  machine_version: number;
  result: SplitRunView['result'];
  error: string | null;
  created_at: Date;
}

export function toRunView(r: RunRow): SplitRunView {
  return {
    id: r.id,
    status: r.status,
    progress: Number(r.progress),
    error: r.error,
    createdAt: new Date(r.created_at).toISOString(),
    limits: r.limits,
    stamp: r.stamp,
    machineVersion: r.machine_version,
    result: r.result,
  };
}

/** The core's answer as stored and shown: margins per section, infeasible assemblies by number. */
export function resultView(result: SplitResult, limits: SplitLimits, numbers: Record<string, string>): NonNullable<SplitRunView['result']> {
  return {
    method: result.method ?? null,
    proposals: result.proposals.map((p) => ({
      score: p.score ?? null,
      sections: p.sections.map((s) => ({
        units: s.units ?? s.assemblyIds.map((assemblyId) => ({ assemblyId, scope: 'whole' as const })),
        assemblyIds: s.assemblyIds,
        massKg: s.massKg,
        cogMm: s.cogMm,
        sizeMm: s.sizeMm,
        massMarginKg: s.margins?.massKg ?? limits.maxSectionMassKg - s.massKg,
        sizeMarginMm: s.margins?.sizeMm ?? null,
      })),
    })),
    infeasible: result.infeasible.map((i) => {
      let reason = i.reason;
      for (const [id, n] of Object.entries(numbers)) reason = reason.split(id).join(n);
      return { assemblyId: i.assemblyId, assemblyNumber: numbers[i.assemblyId] ?? null, reason };
    }),
  };
}

/** Registers the job handler once per app (the runner keeps one handler per kind). */
export function splitRunner(db: Knex, log: Logger): JobRunner {
  const runner = jobRunnerFor(db, log);
  runner.register(
    SPLIT_JOB,
    async (job, ctx) => {
      const runId = String(job.payload.runId);
      const run = await db<RunRow>('split_runs').where({ id: runId }).first();
      if (!run) return;
      await db('split_runs').where({ id: runId }).update({ status: 'running', error: null, updated_at: db.fn.now() });
      const limits = run.limits.limits as SplitLimits;
      const result = await runOnWorker<SplitResult>(
        new URL('./split.worker.ts', import.meta.url),
        { assemblies: run.input.assemblies, parts: run.input.parts, limits, options: { seed: run.options.seed, timeLimitMs: run.options.timeLimitMs, maxProposals: run.options.maxProposals, maxIterations: 1e9 } },
        progressTo(ctx, (progress) => db('split_runs').where({ id: runId, status: 'running' }).update({ progress, updated_at: db.fn.now() }).catch(() => undefined)),
        run.options.timeLimitMs + 60_000,
      );
      await db('split_runs')
        .where({ id: runId })
        .update({ status: 'done', progress: 1, result: JSON.stringify(resultView(result, limits, run.input.numbers)), finished_at: db.fn.now(), updated_at: db.fn.now() });
    },
    async (job, error, status) => {
      if (status === 'failed') await db('split_runs').where({ id: String(job.payload.runId) }).update({ status: 'failed', error: error.message, finished_at: db.fn.now(), updated_at: db.fn.now() });
    },
  );
  return runner;
}

export async function startRun(db: Knex, runner: JobRunner, productionId: string, userId: string, body: StartSplitRunBody & SplitLimitsQuery): Promise<SplitRunView> {
  const [limits, source] = await Promise.all([splitLimits(db, productionId, body), loadSplitSource(db, productionId)]);
  if (!limits.limits) {
    const why = [...limits.mass.problems, ...limits.size.problems];
    throw invalid(`No split can be proposed: ${why.join(' ')}`, why.map((message) => ({ path: 'limits', message })), 'no_limits');
  }
  if (source.parts.length === 0) throw invalid('The machine has no parts to split yet.', [{ path: 'machine', message: 'Add or import parts first.' }], 'no_parts');
  const numbers = Object.fromEntries(source.assemblies.map((a) => [a.id, a.number]));
  const row = await db.transaction(async (trx) => {
    const job = await enqueueJob(trx, { kind: SPLIT_JOB, productionId, payload: {} });
    const [run] = (await trx('split_runs')
      .insert({
        production_id: productionId,
        job_id: job.id,
        limits: JSON.stringify(limits),
        input: JSON.stringify({ ...source.core, numbers }),
        options: JSON.stringify({ seed: body.seed ?? 1, timeLimitMs: body.timeLimitMs ?? 3000, maxProposals: body.maxProposals ?? 3 }),
        stamp: source.stamp,
        machine_version: source.machineVersion,
        created_by: userId,
      })
      .returning('*')) as RunRow[];
    await trx('jobs').where({ id: job.id }).update({ payload: JSON.stringify({ runId: run.id }) });
    return run;
  });
  runner.kick();
  return toRunView(row);
}

export async function findRun(db: Knex, productionId: string, runId: string): Promise<SplitRunView> {
  const row = await db<RunRow>('split_runs').where({ id: runId, production_id: productionId }).first();
  if (!row) throw notFound('The advisor run');
  return toRunView(row);
}

export async function listRuns(db: Knex, productionId: string): Promise<SplitRunView[]> {
  const rows = await db<RunRow>('split_runs').where({ production_id: productionId }).orderBy('created_at', 'desc').limit(10);
  return rows.map((r) => ({ ...toRunView(r), limits: null, result: null }));
}

/** Which section each proposed section becomes: the existing section most of its assemblies are in, else a new one. */
function matchSections(proposed: SectionUnitBody[][], assemblies: AssemblyRow[], existing: SectionRow[]): (SectionRow | null)[] {
  const current = new Map(assemblies.map((a) => [a.id, a.section_id]));
  const pairs: { p: number; s: string; n: number }[] = [];
  proposed.forEach((units, p) => {
    const counts = new Map<string, number>();
    for (const u of units) {
      const s = current.get(u.assemblyId);
      if (s) counts.set(s, (counts.get(s) ?? 0) + 1);
    }
    for (const [s, n] of counts) pairs.push({ p, s, n });
  });
  pairs.sort((a, b) => b.n - a.n || a.p - b.p);
  const out: (SectionRow | null)[] = proposed.map(() => null);
  const used = new Set<string>();
  for (const { p, s } of pairs) {
    if (out[p] || used.has(s)) continue;
    const row = existing.find((e) => e.id === s);
    if (row) {
      out[p] = row;
      used.add(s);
    }
  }
  return out;
}

/**
 * Adopts a split: every assembly gets the section of the unit that holds it, part lines inherit their
 * assembly's section (lines on no assembly take the section of the loose-parts unit), existing sections
 * are kept where most of their assemblies stay, new ones are added (S1, S2 …). One transaction against
 * the breakdown's stamp and the machine's version: 409 with the current state when either moved. The
 * split is checked again here with the same core function the screen uses; a split that breaks a limit
 * is refused, naming the section and the limit.
 */
export async function adoptSplit(db: Knex, productionId: string, body: AdoptSplitBody): Promise<{ machineVersion: number; sections: { id: string; code: string; created: boolean }[]; emptied: string[]; assembliesChanged: number; linesChanged: number }> {
  const limitsView = await splitLimits(db, productionId, body.limits ?? {});
  return db.transaction(async (trx) => {
    const machine = await trx('machines').where({ production_id: productionId }).forUpdate().first();
    if (!machine) throw notFound('The machine');
    const source = await loadSplitSource(trx, productionId);
    if (machine.version !== body.machineVersion || source.stamp !== body.stamp) {
      throw new AppError('conflict', 'The breakdown changed since this split was proposed. Reload it and run the advisor again, or check your edit against the new breakdown.', {
        current: { machineVersion: source.machineVersion, stamp: source.stamp },
      });
    }
    if (!limitsView.limits) {
      const why = [...limitsView.mass.problems, ...limitsView.size.problems];
      throw invalid(`The split cannot be checked: ${why.join(' ')}`, why.map((message) => ({ path: 'limits', message })), 'no_limits');
    }
    const units = body.sections.map((s) => s.units);
    const check = checkSplit({ ...source.core, limits: limitsView.limits }, units);
    if (!check.ok) throw invalid(`The split breaks a rule: ${check.problems.join(' ')}`, check.problems.map((message) => ({ path: 'sections', message })), 'split_invalid');

    const assemblies = await trx<AssemblyRow>('machine_assemblies').where({ production_id: productionId });
    const existing = await trx<SectionRow>('machine_sections').where({ production_id: productionId }).orderBy(['sort_order', 'code']);
    const matched = matchSections(units, assemblies, existing);
    const codes = new Set(existing.map((s) => s.code));
    let next = 1;
    const sectionIds: string[] = [];
    const out: { id: string; code: string; created: boolean }[] = [];
    for (let k = 0; k < units.length; k++) {
      const m = matched[k];
      if (m) {
        sectionIds.push(m.id);
        out.push({ id: m.id, code: m.code, created: false });
        continue;
      }
      while (codes.has(`S${next}`)) next++;
      const code = `S${next}`;
      codes.add(code);
      const [row] = await trx('machine_sections').insert({ production_id: productionId, machine_id: machine.id, code, name: 'From the split advisor', sort_order: existing.length + k + 1 }).returning(['id', 'code']);
      sectionIds.push(row.id);
      out.push({ id: row.id, code: row.code, created: true });
    }
    // The section of every assembly: whole units reach down their subtree.
    const children = new Map<string, string[]>();
    for (const a of assemblies) if (a.parent_id) children.set(a.parent_id, [...(children.get(a.parent_id) ?? []), a.id]);
    const target = new Map<string, string>();
    let looseSection: string | null = null;
    units.forEach((us, k) => {
      for (const u of us) {
        if (u.assemblyId === LOOSE_ASSEMBLY_ID) {
          looseSection = sectionIds[k];
          continue;
        }
        target.set(u.assemblyId, sectionIds[k]);
        if (u.scope === 'whole') {
          const stack = [...(children.get(u.assemblyId) ?? [])];
          while (stack.length) {
            const id = stack.pop() as string;
            target.set(id, sectionIds[k]);
            stack.push(...(children.get(id) ?? []));
          }
        }
      }
    });
    let assembliesChanged = 0;
    for (const a of assemblies) {
      const s = target.get(a.id) ?? null;
      if (s === a.section_id) continue;
      await trx('machine_assemblies').where({ id: a.id }).update({ section_id: s, version: trx.raw('version + 1'), updated_at: trx.fn.now() });
      assembliesChanged++;
    }
    // Lines follow their assembly; lines on no assembly go with the loose-parts unit.
    const linesChanged =
      Number(await trx('machine_part_lines').where({ production_id: productionId }).whereNotNull('assembly_id').whereNotNull('section_id').update({ section_id: null, version: trx.raw('version + 1'), updated_at: trx.fn.now() })) +
      (looseSection
        ? Number(await trx('machine_part_lines').where({ production_id: productionId }).whereNull('assembly_id').whereRaw('section_id is distinct from ?', [looseSection]).update({ section_id: looseSection, version: trx.raw('version + 1'), updated_at: trx.fn.now() }))
        : 0);
    const [m] = await trx('machines').where({ id: machine.id }).update({ version: trx.raw('version + 1'), updated_at: trx.fn.now() }).returning('version');
    const usedIds = new Set(sectionIds);
    return { machineVersion: m.version as number, sections: out, emptied: existing.filter((s) => !usedIds.has(s.id)).map((s) => s.code), assembliesChanged, linesChanged };
  });
}

export { ensureMachine };
