import { productionSettingsBody, type ProductionSettingsBody } from '../../../src/domain/contracts/productions.ts';
import { can, route, uuidParam, type RouteDef } from '../../http/routes.ts';
import { notFound } from '../../http/errors.ts';
import { updateVersioned } from '../../http/versioned.ts';
import type { AppDeps } from '../../app.ts';
import { productionsRepository, toProductionView, type ProductionRow } from './productions.repository.ts';

export function productionRoutes(deps: AppDeps): RouteDef[] {
  const repo = productionsRepository(deps.db);
  return [
    route({
      method: 'get',
      path: '/:productionId',
      access: can('production.read'),
      async handler(req) {
        const row = await repo.find(uuidParam(req, 'productionId'));
        if (!row) throw notFound('The production');
        return { production: toProductionView(row) };
      },
    }),
    route({
      method: 'patch',
      path: '/:productionId',
      access: can('production.settings.edit'),
      body: productionSettingsBody,
      async handler(req) {
        const id = uuidParam(req, 'productionId');
        const body = req.body as ProductionSettingsBody;
        const changes: Record<string, unknown> = {};
        if (body.name !== undefined) changes.name = body.name;
        if (body.paperSize !== undefined) changes.paper_size = body.paperSize;
        if (body.defaultUnits !== undefined) changes.default_units = body.defaultUnits;
        const row = await updateVersioned<ProductionRow>(deps.db, 'productions', { id }, body.version, changes, 'The production', toProductionView);
        return { production: toProductionView(row) };
      },
    }),
    route({
      method: 'get',
      path: '/:productionId/members',
      access: can('production.read'),
      handler: async (req) => ({ members: await repo.members(uuidParam(req, 'productionId')) }),
    }),
  ];
}
