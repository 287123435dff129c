import { allQueries } from '../../db/parallel.ts';
import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import {
  evaluatePlanFields,
  gearIdsOf,
  liftPlanFields,
  type LiftLoadView,
  type LiftPlanSummary,
  type LiftPlanView,
  type LiftPlanFields,
} from '../../../src/domain/contracts/lifting-api.ts';
import type { GearItem, LiftPlanInput } from '../../../src/domain/contracts/lifting.ts';
import type { LiftPlanResult } from '../../../src/domain/lifting/index.ts';
import { decide, type Actor } from '../../../src/domain/policy/index.ts';
import { AppError, conflict, forbidden, invalid, notFound } from '../../http/errors.ts';
import { sectionLoads } from './lift-loads.ts';
import { addEvent, ensureSettings, gearItems, planEvents, userNames, type PlanRow, type SettingsRow } from './lifting.repository.ts';

/**
 * Lift plans: saved with what was typed, what the core was given and what it answered. The server
 * evaluates with the core on every save and every read, so a plan always shows today's figures; a
 * change to the section's mass or CoG, the gear or the settings changes the fingerprint of the
 * evaluated input, and an approval given to another fingerprint is withdrawn (history kept).
 */

/** JSON with object keys sorted, so equal inputs always hash the same. */
export function stableJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(stableJson).join(',')}]`;
  if (value && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>).filter(([, v]) => v !== undefined).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${stableJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value ?? null);
}

export function fingerprintOf(input: LiftPlanInput): string {
  return createHash('sha256').update(stableJson(input)).digest('hex');
}

export interface Evaluation {
  input: LiftPlanInput;
  result: LiftPlanResult;
  fingerprint: string;
  load: LiftLoadView | null;
}

/** Loads what evaluations need once per request (the breakdown's mass properties are the costly part). */
export function planEvaluator(db: Knex, productionId: string) {
  let loads: Promise<Map<string, LiftLoadView>> | null = null;
  let gear: Promise<GearItem[]> | null = null;
  let settings: Promise<SettingsRow> | null = null;
  const venuePoints = new Map<string, Promise<{ label: string; ratingKg: number | null }[]>>();
  const pointsOf = (venueId: string) => {
    if (!venuePoints.has(venueId)) {
      venuePoints.set(
        venueId,
        db('hanging_points')
          .where({ production_id: productionId, venue_id: venueId })
          .select('label', 'rating_kg')
          .then((rows) => rows.map((r) => ({ label: r.label as string, ratingKg: r.rating_kg as number | null }))),
      );
    }
    return venuePoints.get(venueId)!;
  };
  return {
    async loads() {
      loads ??= sectionLoads(db, productionId).then((s) => s.byId);
      return loads;
    },
    async evaluate(fields: LiftPlanFields): Promise<Evaluation> {
      const [l, g, s, vp] = await allQueries(db, [
        () => (loads ??= sectionLoads(db, productionId).then((s) => s.byId)),
        () => (gear ??= gearItems(db, productionId)),
        () => (settings ??= ensureSettings(db, productionId)),
        () => (fields.venueId ? pointsOf(fields.venueId) : Promise.resolve([])),
      ]);
      const load = l.get(fields.sectionId) ?? null;
      const { input, result } = evaluatePlanFields(fields, {
        load,
        gear: g,
        settings: { dynamicFactor: s.dynamic_factor, dynamicFactorSource: s.dynamic_factor_source, hoistRuleSet: s.hoist_rule_set, exclusionMarginMm: s.exclusion_margin_mm },
        venuePoints: vp,
      });
      return { input, result, fingerprint: fingerprintOf(input), load };
    },
  };
}
export type PlanEvaluator = ReturnType<typeof planEvaluator>;

/** What changed between two evaluated inputs, in words, for the history. */
export function describeChange(before: LiftPlanInput | null, after: LiftPlanInput): string {
  if (!before) return 'The plan\'s inputs changed.';
  const parts: string[] = [];
  if (stableJson(before.load) !== stableJson(after.load) || before.contingency !== after.contingency) parts.push('the section\'s mass, CoG or bounds changed');
  const beforeGear = new Map((before.gear ?? []).map((g) => [g.id, stableJson(g)]));
  const changedGear = (after.gear ?? []).filter((g) => beforeGear.get(g.id) !== stableJson(g)).map((g) => `${g.kind} ${g.identifier}`);
  const removed = (before.gear ?? []).filter((g) => !(after.gear ?? []).some((a) => a.id === g.id)).map((g) => `${g.kind} ${g.identifier}`);
  if (changedGear.length) parts.push(`gear changed: ${changedGear.join(', ')}`);
  if (removed.length) parts.push(`gear no longer available: ${removed.join(', ')}`);
  const rest = (x: LiftPlanInput) => stableJson({ ...x, load: null, gear: null, contingency: null });
  if (rest(before) !== rest(after)) parts.push('the plan, its hanging point or the production\'s lifting settings changed');
  return parts.length ? `${parts.join('; ')}.` : 'The evaluated input changed.';
}

export function parseFields(row: PlanRow): LiftPlanFields {
  return liftPlanFields.parse(row.inputs);
}

/**
 * Brings one plan up to date with the section, the gear and the settings. An approved plan whose
 * evaluated input changed goes back to draft with an 'approval-withdrawn' event; any other plan just
 * gets today's result. Returns the row as it now stands.
 */
export async function refreshPlan(db: Knex, ev: PlanEvaluator, row: PlanRow): Promise<{ row: PlanRow; evaluation: Evaluation }> {
  const evaluation = await ev.evaluate(parseFields(row));
  if (evaluation.fingerprint === row.fingerprint) return { row, evaluation };
  const common = {
    evaluated_input: JSON.stringify(evaluation.input),
    result: JSON.stringify(evaluation.result),
    verdict: evaluation.result.verdict,
    fingerprint: evaluation.fingerprint,
  };
  if (row.status === 'approved') {
    const why = describeChange(row.evaluated_input as LiftPlanInput, evaluation.input);
    return db.transaction(async (trx) => {
      const [updated] = (await trx('lift_plans')
        .where({ id: row.id, version: row.version })
        .update({ ...common, status: 'draft', approved_fingerprint: null, version: trx.raw('version + 1'), updated_at: trx.fn.now() })
        .returning('*')) as PlanRow[];
      if (!updated) return { row: (await trx<PlanRow>('lift_plans').where({ id: row.id }).first())!, evaluation };
      await addEvent(trx, row, 'approval-withdrawn', null, { comment: `Approval withdrawn: ${why} Review the plan again.`, verdict: evaluation.result.verdict, fingerprint: evaluation.fingerprint });
      return { row: updated, evaluation };
    });
  }
  // A submitted plan's figures moved under its reviewer: a new version, so an approval of the old
  // figures answers 409. A draft's typed inputs did not change, so its version stays (no needless 409).
  const bump = row.status === 'submitted' ? { version: db.raw('version + 1'), updated_at: db.fn.now() } : {};
  const [updated] = (await db('lift_plans').where({ id: row.id, version: row.version }).update({ ...common, ...bump }).returning('*')) as PlanRow[];
  return { row: updated ?? row, evaluation };
}

/** Every plan of the production (or of one gear item) brought up to date: after a gear edit. */
export async function refreshPlansUsingGear(db: Knex, productionId: string, gearId: string): Promise<void> {
  const rows = await db<PlanRow>('lift_plans').where({ production_id: productionId });
  const ev = planEvaluator(db, productionId);
  for (const row of rows) {
    const fields = liftPlanFields.safeParse(row.inputs);
    if (fields.success && gearIdsOf(fields.data).includes(gearId)) await refreshPlan(db, ev, row);
  }
}

export type PlanSummary = LiftPlanSummary;
export type PlanView = LiftPlanView;

const iso = (d: Date | null) => (d ? new Date(d).toISOString() : null);

export async function planView(db: Knex, row: PlanRow, evaluation: Evaluation): Promise<PlanView> {
  const names = await userNames(db, [row.author_id, row.reviewer_id]);
  const fields = parseFields(row);
  return {
    id: row.id,
    title: row.title,
    status: row.status,
    sectionId: row.section_id,
    sectionCode: evaluation.load?.code ?? null,
    venueId: row.venue_id,
    verdict: row.verdict,
    authorId: row.author_id,
    authorName: row.author_id ? (names.get(row.author_id) ?? null) : null,
    liftDate: fields.liftDate,
    version: row.version,
    updatedAt: new Date(row.updated_at).toISOString(),
    inputs: fields,
    evaluatedInput: evaluation.input,
    result: evaluation.result,
    load: evaluation.load,
    reviewerId: row.reviewer_id,
    reviewerName: row.reviewer_id ? (names.get(row.reviewer_id) ?? null) : null,
    reviewedAt: iso(row.reviewed_at),
    reviewComment: row.review_comment,
    submittedAt: iso(row.submitted_at),
    createdAt: new Date(row.created_at).toISOString(),
    events: await planEvents(db, row.id),
  };
}

/** Reads a plan of the production, checking venue scope for venue users. */
export async function findPlan(db: Knex, actor: Actor, productionId: string, planId: string): Promise<PlanRow> {
  const row = await db<PlanRow>('lift_plans').where({ id: planId, production_id: productionId }).first();
  if (!row) throw notFound('The lift plan');
  const d = decide(actor, 'liftplan.read', { productionId, venueId: row.venue_id });
  if (!d.allowed) throw forbidden(d.reason);
  return row;
}

/** Section and venue must belong to the production. */
export async function checkReferences(db: Knex, productionId: string, fields: LiftPlanFields): Promise<void> {
  const issues: { path: string; message: string }[] = [];
  const section = await db('machine_sections').where({ id: fields.sectionId, production_id: productionId }).first('id');
  if (!section) issues.push({ path: 'inputs.sectionId', message: 'No section with that id in this production.' });
  if (fields.venueId) {
    const venue = await db('venues').where({ id: fields.venueId, production_id: productionId }).first('id');
    if (!venue) issues.push({ path: 'inputs.venueId', message: 'No venue with that id in this production.' });
  }
  if (issues.length) throw invalid('Some fields are not valid.', issues);
}

export async function createPlan(db: Knex, actor: Actor, productionId: string, fields: LiftPlanFields): Promise<PlanRow> {
  await checkReferences(db, productionId, fields);
  const evaluation = await planEvaluator(db, productionId).evaluate(fields);
  return db.transaction(async (trx) => {
    const [row] = (await trx('lift_plans')
      .insert({
        production_id: productionId,
        section_id: fields.sectionId,
        venue_id: fields.venueId,
        title: fields.title,
        status: 'draft',
        inputs: JSON.stringify(fields),
        evaluated_input: JSON.stringify(evaluation.input),
        result: JSON.stringify(evaluation.result),
        verdict: evaluation.result.verdict,
        fingerprint: evaluation.fingerprint,
        author_id: actor.userId,
      })
      .returning('*')) as PlanRow[];
    await addEvent(trx, row, 'created', actor.userId, { verdict: row.verdict, fingerprint: row.fingerprint });
    return row;
  });
}

/** Locks the plan and checks the version the person started from (409 with the current plan otherwise). */
async function lockAt(trx: Knex.Transaction, productionId: string, planId: string, version: number, present: (row: PlanRow) => Promise<unknown>): Promise<PlanRow> {
  const row = await trx<PlanRow>('lift_plans').where({ id: planId, production_id: productionId }).forUpdate().first();
  if (!row) throw notFound('The lift plan');
  if (row.version !== version) throw conflict(await present(row));
  return row;
}

/**
 * Saves new inputs. An approved plan loses its approval ('approval-withdrawn'); a submitted or rejected
 * one goes back to draft: what was reviewed is no longer what is planned.
 */
export async function updatePlan(
  db: Knex,
  actor: Actor,
  productionId: string,
  planId: string,
  version: number,
  fields: LiftPlanFields,
  present: (row: PlanRow) => Promise<unknown>,
): Promise<PlanRow> {
  await checkReferences(db, productionId, fields);
  const evaluation = await planEvaluator(db, productionId).evaluate(fields);
  return db.transaction(async (trx) => {
    const row = await lockAt(trx, productionId, planId, version, present);
    const [updated] = (await trx('lift_plans')
      .where({ id: row.id })
      .update({
        section_id: fields.sectionId,
        venue_id: fields.venueId,
        title: fields.title,
        status: 'draft',
        inputs: JSON.stringify(fields),
        evaluated_input: JSON.stringify(evaluation.input),
        result: JSON.stringify(evaluation.result),
        verdict: evaluation.result.verdict,
        fingerprint: evaluation.fingerprint,
        approved_fingerprint: null,
        version: trx.raw('version + 1'),
        updated_at: trx.fn.now(),
      })
      .returning('*')) as PlanRow[];
    if (row.status === 'approved') {
      await addEvent(trx, row, 'approval-withdrawn', actor.userId, { comment: 'Approval withdrawn: the plan was edited. Review it again.', verdict: updated.verdict, fingerprint: updated.fingerprint });
    } else if (row.status !== 'draft') {
      await addEvent(trx, row, 'returned-to-draft', actor.userId, { comment: `The plan was edited while ${row.status}.`, verdict: updated.verdict, fingerprint: updated.fingerprint });
    }
    await addEvent(trx, row, 'edited', actor.userId, { verdict: updated.verdict, fingerprint: updated.fingerprint });
    return updated;
  });
}

export async function submitPlan(db: Knex, actor: Actor, productionId: string, planId: string, version: number, comment: string, present: (row: PlanRow) => Promise<unknown>): Promise<PlanRow> {
  const current = await findPlan(db, actor, productionId, planId);
  const { row: fresh, evaluation } = await refreshPlan(db, planEvaluator(db, productionId), current);
  return db.transaction(async (trx) => {
    const row = await lockAt(trx, productionId, planId, version, present);
    if (row.status !== 'draft' && row.status !== 'rejected') {
      throw new AppError('conflict', `Only a draft or rejected plan can be submitted; this one is ${row.status}.`, { current: await present(row), code: 'wrong_status' });
    }
    const [updated] = (await trx('lift_plans')
      .where({ id: row.id })
      .update({ status: 'submitted', submitted_at: trx.fn.now(), reviewer_id: null, reviewed_at: null, review_comment: '', version: trx.raw('version + 1'), updated_at: trx.fn.now() })
      .returning('*')) as PlanRow[];
    await addEvent(trx, row, 'submitted', actor.userId, { comment, verdict: fresh.verdict, fingerprint: evaluation.fingerprint });
    return updated;
  });
}

/**
 * A rigger who is not the author approves or rejects a submitted plan. An approval is given only to
 * the figures the reviewer saw (the fingerprint must not have moved since the plan was read) and
 * only to a plan with no unresolved problem: nothing is saved as approved otherwise.
 */
export async function decidePlan(
  db: Knex,
  actor: Actor,
  productionId: string,
  planId: string,
  version: number,
  outcome: 'approved' | 'rejected',
  comment: string,
  present: (row: PlanRow) => Promise<unknown>,
): Promise<PlanRow> {
  const before = await db<PlanRow>('lift_plans').where({ id: planId, production_id: productionId }).first();
  if (!before) throw notFound('The lift plan');
  const d = decide(actor, 'liftplan.review', { productionId, authorId: before.author_id });
  if (!d.allowed) throw forbidden(d.reason);
  const evaluation = await planEvaluator(db, productionId).evaluate(parseFields(before));
  return db.transaction(async (trx) => {
    const row = await lockAt(trx, productionId, planId, version, present);
    if (row.status !== 'submitted') {
      throw new AppError('conflict', `Only a submitted plan can be ${outcome}; this one is ${row.status}.`, { current: await present(row), code: 'wrong_status' });
    }
    if (evaluation.fingerprint !== row.fingerprint) {
      // The section, the gear or the settings moved since the reviewer read the plan: show the new figures.
      await trx('lift_plans')
        .where({ id: row.id })
        .update({
          evaluated_input: JSON.stringify(evaluation.input),
          result: JSON.stringify(evaluation.result),
          verdict: evaluation.result.verdict,
          fingerprint: evaluation.fingerprint,
          version: trx.raw('version + 1'),
          updated_at: trx.fn.now(),
        });
      const fresh = (await trx<PlanRow>('lift_plans').where({ id: row.id }).first())!;
      throw new AppError('conflict', `The figures changed since this plan was read (${describeChange(row.evaluated_input as LiftPlanInput, evaluation.input)}) Review the new figures.`, {
        current: await present(fresh),
        code: 'figures_changed',
      });
    }
    if (outcome === 'approved' && (evaluation.result.verdict !== 'ok' || evaluation.result.problems.length > 0)) {
      const list = evaluation.result.problems.length ? evaluation.result.problems : [`The verdict is "${evaluation.result.verdict}".`];
      throw invalid(`This plan cannot be approved while it has unresolved problems: ${list.join(' ')}`, list.map((message) => ({ path: 'result', message })), 'plan_has_problems');
    }
    const [updated] = (await trx('lift_plans')
      .where({ id: row.id })
      .update({
        status: outcome,
        reviewer_id: actor.userId,
        reviewed_at: trx.fn.now(),
        review_comment: comment,
        approved_fingerprint: outcome === 'approved' ? row.fingerprint : null,
        version: trx.raw('version + 1'),
        updated_at: trx.fn.now(),
      })
      .returning('*')) as PlanRow[];
    await addEvent(trx, row, outcome, actor.userId, { comment, verdict: row.verdict, fingerprint: row.fingerprint });
    return updated;
  });
}

export async function deletePlan(db: Knex, productionId: string, planId: string): Promise<void> {
  const row = await db<PlanRow>('lift_plans').where({ id: planId, production_id: productionId }).first();
  if (!row) throw notFound('The lift plan');
  if (row.status === 'submitted' || row.status === 'approved') {
    throw new AppError('conflict', `A ${row.status} plan cannot be deleted; edit it (which returns it to draft) first.`, { code: 'wrong_status' });
  }
  await db('lift_plans').where({ id: row.id }).delete();
}
