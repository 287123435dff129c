import type { Request } from 'express';
import { adoptSplitBody, splitLimitsQuery, startSplitRunBody, type AdoptSplitBody, type SplitLimitsQuery, type StartSplitRunBody } from '../../../src/domain/contracts/split.ts';
import type { AppDeps } from '../../app.ts';
import { can, route, uuidParam, type RouteDef } from '../../http/routes.ts';
import { loadSplitSource } from './split-input.ts';
import { splitLimits } from './split-limits.ts';
import { adoptSplit, findRun, listRuns, splitRunner, startRun } from './split.service.ts';

/**
 * The split advisor under `/api/productions/:productionId/split`: the breakdown as the advisor sees it,
 * the limits with their sources, advisor runs (202, then polled) and adoption of a split.
 */
export function splitRoutes(deps: AppDeps): RouteDef[] {
  const { db, log } = deps;
  const pid = (req: Request) => uuidParam(req, 'productionId');
  const runner = splitRunner(db, log);
  return [
    route({
      method: 'get',
      path: '/input',
      access: can('machine.read'),
      async handler(req) {
        const { core: _core, ...view } = await loadSplitSource(db, pid(req));
        return { input: view };
      },
    }),
    route({
      method: 'get',
      path: '/limits',
      access: can('machine.read'),
      query: splitLimitsQuery,
      handler: async (req) => ({ limits: await splitLimits(db, pid(req), req.query as unknown as SplitLimitsQuery) }),
    }),
    route({
      method: 'get',
      path: '/runs',
      access: can('machine.read'),
      handler: async (req) => ({ runs: await listRuns(db, pid(req)) }),
    }),
    route({
      method: 'post',
      path: '/runs',
      access: can('machine.edit'),
      body: startSplitRunBody,
      async handler(req, res) {
        const run = await startRun(db, runner, pid(req), req.actor!.userId, req.body as StartSplitRunBody & SplitLimitsQuery);
        res.status(202);
        return { run };
      },
    }),
    route({
      method: 'get',
      path: '/runs/:runId',
      access: can('machine.read'),
      handler: async (req) => ({ run: await findRun(db, pid(req), uuidParam(req, 'runId')) }),
    }),
    route({
      method: 'post',
      path: '/adopt',
      access: can('machine.edit'),
      body: adoptSplitBody,
      handler: async (req) => ({ adopted: await adoptSplit(db, pid(req), req.body as AdoptSplitBody) }),
    }),
  ];
}
