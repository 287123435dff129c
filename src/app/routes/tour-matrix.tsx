import { AccessMatrixPage } from '../../features/tour/components/access-matrix-page.tsx';
import { RequireAction } from '../layout/require-action.tsx';

/** Lazy route module: `/p/:productionId/tour/matrix` (planners, riggers). */
export function Component() {
  return (
    <RequireAction action="tour.read">
      <AccessMatrixPage />
    </RequireAction>
  );
}
