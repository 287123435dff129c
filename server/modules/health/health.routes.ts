import { PUBLIC, route, type RouteDef } from '../../http/routes.ts';
import { AppError } from '../../http/errors.ts';
import type { AppDeps } from '../../app.ts';

export function healthRoutes(deps: AppDeps): RouteDef[] {
  return [
    route({
      method: 'get',
      path: '/health',
      access: PUBLIC,
      async handler() {
        try {
          await deps.db.raw('select 1');
        } catch {
          throw new AppError('unavailable', 'The database is not reachable.', { code: 'database_down' });
        }
        return { ok: true, database: 'up' };
      },
    }),
  ];
}
