import type { Request } from 'express';
import { impactApplyBody, impactEvaluateBody, type ImpactDraftParsed } from '../../../src/domain/contracts/split.ts';
import type { AppDeps } from '../../app.ts';
import { can, route, uuidParam, type RouteDef } from '../../http/routes.ts';
import { applyDraft, evaluateDraft } from './impact.service.ts';

/**
 * The impact view under `/api/productions/:productionId/impact`: evaluate a draft without saving it, or
 * apply it in one transaction (the service checks each kind of change against the person's role).
 */
export function impactRoutes(deps: AppDeps): RouteDef[] {
  const { db } = deps;
  const pid = (req: Request) => uuidParam(req, 'productionId');
  return [
    route({
      method: 'post',
      path: '/evaluate',
      access: can('machine.read'),
      body: impactEvaluateBody,
      async handler(req) {
        const { loaded: _l, ...impact } = await evaluateDraft(db, pid(req), (req.body as { draft: ImpactDraftParsed }).draft, req.units ?? 'metric');
        return { impact };
      },
    }),
    route({
      method: 'post',
      path: '/apply',
      access: can('machine.edit'),
      body: impactApplyBody,
      handler: async (req) => ({ impact: await applyDraft(db, req.actor!, pid(req), (req.body as { draft: ImpactDraftParsed }).draft, req.units ?? 'metric'), applied: true }),
    }),
  ];
}
