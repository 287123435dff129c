import { OverviewPage } from '../../features/productions/components/overview-page.tsx';
import { RequireAction } from '../layout/require-action.tsx';

/** Lazy route module: `/p/:productionId`. */
export function Component() {
  return (
    <RequireAction action="production.read">
      <OverviewPage />
    </RequireAction>
  );
}
