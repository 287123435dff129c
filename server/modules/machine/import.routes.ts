import type { RouteDef } from '../../http/routes.ts';
import type { AppDeps } from '../../app.ts';

/** Parts-list import and export: filled in once the breakdown core (src/domain/breakdown) lands. */
export function importRoutes(_deps: AppDeps): RouteDef[] {
  return [];
}
