import type { Request } from 'express';
import {
  gearCreateBody,
  gearIdsOf,
  gearUpdateBody,
  handlingTaskBody,
  hangingPointCreateBody,
  hangingPointUpdateBody,
  liftingSettingsBody,
  liftPlanActionBody,
  liftPlanCreateBody,
  liftPlanFields,
  liftPlanRejectBody,
  liftPlanUpdateBody,
  type GearCreateBody,
  type GearUpdateBody,
  type HandlingTaskBody,
  type HangingPointCreateBody,
  type HangingPointUpdateBody,
  type LiftingSettingsBody,
  type LiftPlanActionBody,
  type LiftPlanFields,
} from '../../../src/domain/contracts/lifting-api.ts';
import type { LiftPlanInput } from '../../../src/domain/contracts/lifting.ts';
import type { LiftPlanResult } from '../../../src/domain/lifting/index.ts';
import { decide, membershipFor } from '../../../src/domain/policy/index.ts';
import { AppError, forbidden, notFound } from '../../http/errors.ts';
import { can, route, uuidParam, type RouteDef } from '../../http/routes.ts';
import { updateVersioned } from '../../http/versioned.ts';
import type { AppDeps } from '../../app.ts';
import { handlingList, saveHandlingTask } from './handling.service.ts';
import { renderLiftPlanPdf } from './lift-plan.pdf.ts';
import { sectionLoads } from './lift-loads.ts';
import {
  createPlan,
  decidePlan,
  deletePlan,
  findPlan,
  planEvaluator,
  planView,
  refreshPlan,
  refreshPlansUsingGear,
  submitPlan,
  updatePlan,
  type PlanSummary,
} from './lift-plans.service.ts';
import {
  ensureSettings,
  gearColumns,
  hangingPointsQuery,
  toGearView,
  toHangingPointView,
  toSettingsView,
  userNames,
  type GearRow,
  type HangingPointRow,
  type PlanRow,
  type SettingsRow,
} from './lifting.repository.ts';

/**
 * Lifting under `/api/productions/:productionId/lifting`: settings, gear inventory, hanging points,
 * manual-handling verdicts, lift plans with sign-off, and the lift plan PDF. Every query is scoped by
 * the production in the path; saves of existing rows answer 409 with the current record when stale.
 */
export function liftingRoutes(deps: AppDeps): RouteDef[] {
  const { db } = deps;
  const pid = (req: Request) => uuidParam(req, 'productionId');

  /** A plan as stored (no re-evaluation): for 409 answers. */
  const presentStored = async (row: PlanRow) =>
    planView(db, row, { input: row.evaluated_input as LiftPlanInput, result: row.result as LiftPlanResult, fingerprint: row.fingerprint, load: null });

  const viewOf = async (productionId: string, row: PlanRow) => {
    const ev = planEvaluator(db, productionId);
    const fresh = await refreshPlan(db, ev, row);
    return planView(db, fresh.row, fresh.evaluation);
  };

  const identifierTaken = (e: unknown) => (e as { code?: string }).code === '23505';
  const takenError = (identifier: string) =>
    new AppError('conflict', `Gear with identifier "${identifier}" already exists in this production.`, {
      issues: [{ path: 'item.identifier', message: `"${identifier}" is already used by another item.` }],
      code: 'identifier_taken',
    });

  return [
    // ------------------------------------------------------------------------------------ settings
    route({
      method: 'get',
      path: '/settings',
      access: can('liftplan.read'),
      handler: async (req) => ({ settings: toSettingsView(await ensureSettings(db, pid(req))) }),
    }),
    route({
      method: 'patch',
      path: '/settings',
      access: can('production.settings.edit'),
      body: liftingSettingsBody,
      async handler(req) {
        const productionId = pid(req);
        const b = req.body as LiftingSettingsBody;
        await ensureSettings(db, productionId);
        const map: Record<string, string> = {
          handlingMethod: 'handling_method',
          guidelineColumn: 'guideline_column',
          handlingThresholdKg: 'handling_threshold_kg',
          maxTeamSize: 'max_team_size',
          dynamicFactor: 'dynamic_factor',
          dynamicFactorSource: 'dynamic_factor_source',
          hoistRuleSet: 'hoist_rule_set',
          exclusionMarginMm: 'exclusion_margin_mm',
        };
        const changes: Record<string, unknown> = {};
        for (const [k, col] of Object.entries(map)) if ((b as Record<string, unknown>)[k] !== undefined) changes[col] = (b as Record<string, unknown>)[k];
        const row = await updateVersioned<SettingsRow>(db, 'lifting_settings', { production_id: productionId }, b.version, changes, 'The lifting settings', toSettingsView);
        return { settings: toSettingsView(row) };
      },
    }),

    // ------------------------------------------------------------------------------------ loads
    route({
      method: 'get',
      path: '/loads',
      access: can('liftplan.read'),
      async handler(req) {
        const productionId = pid(req);
        const d = decide(req.actor!, 'liftplan.read', { productionId, venueId: null });
        if (!d.allowed) throw forbidden(d.reason);
        return { loads: (await sectionLoads(db, productionId)).loads };
      },
    }),

    // ------------------------------------------------------------------------------------ gear
    route({
      method: 'get',
      path: '/gear',
      access: can('gear.read'),
      async handler(req) {
        const rows = await db<GearRow>('lifting_gear').where({ production_id: pid(req) }).orderBy(['kind', 'identifier']);
        return { gear: rows.map(toGearView) };
      },
    }),
    route({
      method: 'post',
      path: '/gear',
      access: can('gear.edit'),
      body: gearCreateBody,
      async handler(req, res) {
        const { item } = req.body as GearCreateBody;
        try {
          const [row] = (await db('lifting_gear')
            .insert({ production_id: pid(req), ...gearColumns(item) })
            .returning('*')) as GearRow[];
          res.status(201);
          return { gear: toGearView(row) };
        } catch (e) {
          if (identifierTaken(e)) throw takenError(item.identifier);
          throw e;
        }
      },
    }),
    route({
      method: 'patch',
      path: '/gear/:gearId',
      access: can('gear.edit'),
      body: gearUpdateBody,
      async handler(req) {
        const productionId = pid(req);
        const id = uuidParam(req, 'gearId');
        const b = req.body as GearUpdateBody;
        const existing = await db<GearRow>('lifting_gear').where({ id, production_id: productionId }).first();
        if (!existing) throw notFound('The gear item');
        if (existing.kind !== b.item.kind) {
          throw new AppError('invalid', 'Some fields are not valid.', { issues: [{ path: 'item.kind', message: `A ${existing.kind} cannot become a ${b.item.kind}; add a new item instead.` }] });
        }
        let row: GearRow;
        try {
          row = await updateVersioned<GearRow>(db, 'lifting_gear', { id, production_id: productionId }, b.version, gearColumns(b.item), 'The gear item', toGearView);
        } catch (e) {
          if (identifierTaken(e)) throw takenError(b.item.identifier);
          throw e;
        }
        // A changed item withdraws the approval of every plan that uses it.
        await refreshPlansUsingGear(db, productionId, id);
        return { gear: toGearView(row) };
      },
    }),
    route({
      method: 'delete',
      path: '/gear/:gearId',
      access: can('gear.edit'),
      async handler(req) {
        const productionId = pid(req);
        const id = uuidParam(req, 'gearId');
        const existing = await db<GearRow>('lifting_gear').where({ id, production_id: productionId }).first();
        if (!existing) throw notFound('The gear item');
        const plans = await db<PlanRow>('lift_plans').where({ production_id: productionId }).select('id', 'title', 'inputs');
        const users = plans.filter((p) => {
          const f = liftPlanFields.safeParse(p.inputs);
          return f.success && gearIdsOf(f.data).includes(id);
        });
        if (users.length) {
          throw new AppError('conflict', `${existing.kind} ${existing.identifier} is used by ${users.length} lift plan${users.length === 1 ? '' : 's'} (${users.map((p) => p.title).join(', ')}): take it out of them first.`, { code: 'gear_in_use' });
        }
        await db('lifting_gear').where({ id }).delete();
      },
    }),

    // ------------------------------------------------------------------------------------ hanging points
    route({
      method: 'get',
      path: '/hanging-points',
      access: can('liftplan.read'),
      async handler(req) {
        const productionId = pid(req);
        const m = membershipFor(req.actor!, productionId);
        let q = hangingPointsQuery(db, productionId);
        // Venue staff see their own venues' points only.
        if (m?.role === 'venue') q = q.whereIn('h.venue_id', m.venueIds);
        return { hangingPoints: (await q).map(toHangingPointView) };
      },
    }),
    route({
      method: 'post',
      path: '/hanging-points',
      access: can('venue.edit'),
      body: hangingPointCreateBody,
      async handler(req, res) {
        const productionId = pid(req);
        const b = req.body as HangingPointCreateBody;
        const d = decide(req.actor!, 'venue.edit', { productionId, venueId: b.venueId });
        if (!d.allowed) throw forbidden(d.reason);
        const venue = await db('venues').where({ id: b.venueId, production_id: productionId }).first('id', 'name');
        if (!venue) throw new AppError('invalid', 'Some fields are not valid.', { issues: [{ path: 'venueId', message: 'No venue with that id in this production.' }] });
        try {
          const [row] = (await db('hanging_points')
            .insert({ production_id: productionId, venue_id: b.venueId, label: b.label, rating_kg: b.ratingKg, notes: b.notes })
            .returning('*')) as HangingPointRow[];
          res.status(201);
          return { hangingPoint: toHangingPointView({ ...row, venue_name: venue.name }) };
        } catch (e) {
          if (identifierTaken(e)) throw new AppError('conflict', `This venue already has a hanging point "${b.label}".`, { issues: [{ path: 'label', message: 'Already used at this venue.' }] });
          throw e;
        }
      },
    }),
    route({
      method: 'patch',
      path: '/hanging-points/:pointId',
      access: can('venue.edit'),
      body: hangingPointUpdateBody,
      async handler(req) {
        const productionId = pid(req);
        const id = uuidParam(req, 'pointId');
        const b = req.body as HangingPointUpdateBody;
        const existing = await db<HangingPointRow>('hanging_points').where({ id, production_id: productionId }).first();
        if (!existing) throw notFound('The hanging point');
        const d = decide(req.actor!, 'venue.edit', { productionId, venueId: existing.venue_id });
        if (!d.allowed) throw forbidden(d.reason);
        const venue = await db('venues').where({ id: existing.venue_id }).first('name');
        const changes: Record<string, unknown> = {};
        if (b.label !== undefined) changes.label = b.label;
        if (b.ratingKg !== undefined) changes.rating_kg = b.ratingKg;
        if (b.notes !== undefined) changes.notes = b.notes;
        const row = await updateVersioned<HangingPointRow>(db, 'hanging_points', { id, production_id: productionId }, b.version, changes, 'The hanging point', (r) =>
          toHangingPointView({ ...r, venue_name: venue?.name ?? '' }),
        );
        return { hangingPoint: toHangingPointView({ ...row, venue_name: venue?.name ?? '' }) };
      },
    }),
    route({
      method: 'delete',
      path: '/hanging-points/:pointId',
      access: can('venue.edit'),
      async handler(req) {
        const productionId = pid(req);
        const id = uuidParam(req, 'pointId');
        const existing = await db<HangingPointRow>('hanging_points').where({ id, production_id: productionId }).first();
        if (!existing) throw notFound('The hanging point');
        const d = decide(req.actor!, 'venue.edit', { productionId, venueId: existing.venue_id });
        if (!d.allowed) throw forbidden(d.reason);
        await db('hanging_points').where({ id }).delete();
      },
    }),

    // ------------------------------------------------------------------------------------ manual handling
    route({
      method: 'get',
      path: '/handling',
      access: can('liftplan.read'),
      async handler(req) {
        const productionId = pid(req);
        const d = decide(req.actor!, 'liftplan.read', { productionId, venueId: null });
        if (!d.allowed) throw forbidden(d.reason);
        return handlingList(db, productionId);
      },
    }),
    route({
      method: 'put',
      path: '/handling/:itemId',
      access: can('liftplan.edit'),
      body: handlingTaskBody,
      async handler(req) {
        const saved = await saveHandlingTask(db, pid(req), uuidParam(req, 'itemId'), req.body as HandlingTaskBody, req.actor!.userId);
        return { task: saved.task, version: saved.version };
      },
    }),

    // ------------------------------------------------------------------------------------ lift plans
    route({
      method: 'get',
      path: '/plans',
      access: can('liftplan.read'),
      async handler(req) {
        const productionId = pid(req);
        const actor = req.actor!;
        const rows = await db<PlanRow>('lift_plans').where({ production_id: productionId }).orderBy('updated_at', 'desc');
        const visible = rows.filter((r) => decide(actor, 'liftplan.read', { productionId, venueId: r.venue_id }).allowed);
        const ev = planEvaluator(db, productionId);
        const fresh = [];
        for (const r of visible) fresh.push(await refreshPlan(db, ev, r));
        const names = await userNames(db, fresh.map((f) => f.row.author_id));
        const plans: PlanSummary[] = fresh.map(({ row, evaluation }) => ({
          id: row.id,
          title: row.title,
          status: row.status,
          sectionId: row.section_id,
          sectionCode: evaluation.load?.code ?? null,
          venueId: row.venue_id,
          verdict: row.verdict,
          problemCount: evaluation.result.problems.length,
          authorId: row.author_id,
          authorName: row.author_id ? (names.get(row.author_id) ?? null) : null,
          liftDate: (row.inputs as LiftPlanFields).liftDate,
          version: row.version,
          updatedAt: new Date(row.updated_at).toISOString(),
        }));
        return { plans };
      },
    }),
    route({
      method: 'post',
      path: '/plans',
      access: can('liftplan.edit'),
      body: liftPlanCreateBody,
      async handler(req, res) {
        const productionId = pid(req);
        const row = await createPlan(db, req.actor!, productionId, (req.body as { inputs: LiftPlanFields }).inputs);
        res.status(201);
        return { plan: await viewOf(productionId, row) };
      },
    }),
    route({
      method: 'get',
      path: '/plans/:planId',
      access: can('liftplan.read'),
      async handler(req) {
        const productionId = pid(req);
        const row = await findPlan(db, req.actor!, productionId, uuidParam(req, 'planId'));
        return { plan: await viewOf(productionId, row) };
      },
    }),
    route({
      method: 'patch',
      path: '/plans/:planId',
      access: can('liftplan.edit'),
      body: liftPlanUpdateBody,
      async handler(req) {
        const productionId = pid(req);
        const b = req.body as { version: number; inputs: LiftPlanFields };
        const planId = uuidParam(req, 'planId');
        await findPlan(db, req.actor!, productionId, planId);
        const row = await updatePlan(db, req.actor!, productionId, planId, b.version, b.inputs, presentStored);
        return { plan: await viewOf(productionId, row) };
      },
    }),
    route({
      method: 'delete',
      path: '/plans/:planId',
      access: can('liftplan.edit'),
      handler: async (req) => deletePlan(db, pid(req), uuidParam(req, 'planId')),
    }),
    route({
      method: 'post',
      path: '/plans/:planId/submit',
      access: can('liftplan.edit'),
      body: liftPlanActionBody,
      async handler(req) {
        const productionId = pid(req);
        const b = req.body as LiftPlanActionBody;
        const row = await submitPlan(db, req.actor!, productionId, uuidParam(req, 'planId'), b.version, b.comment ?? '', presentStored);
        return { plan: await viewOf(productionId, row) };
      },
    }),
    route({
      method: 'post',
      path: '/plans/:planId/approve',
      access: can('liftplan.review'),
      body: liftPlanActionBody,
      async handler(req) {
        const productionId = pid(req);
        const b = req.body as LiftPlanActionBody;
        const row = await decidePlan(db, req.actor!, productionId, uuidParam(req, 'planId'), b.version, 'approved', b.comment ?? '', presentStored);
        return { plan: await viewOf(productionId, row) };
      },
    }),
    route({
      method: 'post',
      path: '/plans/:planId/reject',
      access: can('liftplan.review'),
      body: liftPlanRejectBody,
      async handler(req) {
        const productionId = pid(req);
        const b = req.body as { version: number; comment: string };
        const row = await decidePlan(db, req.actor!, productionId, uuidParam(req, 'planId'), b.version, 'rejected', b.comment, presentStored);
        return { plan: await viewOf(productionId, row) };
      },
    }),
    route({
      method: 'get',
      path: '/plans/:planId/pdf',
      access: can('liftplan.read'),
      async handler(req, res) {
        const productionId = pid(req);
        const row = await findPlan(db, req.actor!, productionId, uuidParam(req, 'planId'));
        const view = await viewOf(productionId, row);
        const [production, venue, me] = await Promise.all([
          db('productions').where({ id: productionId }).first('name', 'paper_size'),
          view.venueId ? db('venues').where({ id: view.venueId }).first('name') : Promise.resolve(null),
          db('users').where({ id: req.actor!.userId }).first('name'),
        ]);
        const pdf = await renderLiftPlanPdf(view, {
          paperSize: production?.paper_size === 'Letter' ? 'Letter' : 'A4',
          productionName: production?.name ?? '',
          printedBy: me?.name ?? '',
          printedOn: new Date().toISOString().slice(0, 10),
          venueName: venue?.name ?? null,
        });
        const safe = view.title.replace(/[^\w.-]+/g, '-').slice(0, 60) || 'lift-plan';
        res.setHeader('Content-Type', 'application/pdf');
        res.setHeader('Content-Disposition', `inline; filename="lift-plan-${safe}.pdf"`);
        res.send(pdf);
      },
    }),
  ];
}
