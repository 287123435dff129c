import { TourPage } from '../../features/tour/components/tour-page.tsx';
import { RequireAction } from '../layout/require-action.tsx';

/** Lazy route module: `/p/:productionId/tour` (planners, riggers; venue staff see their own engagements). */
export function Component() {
  return (
    <RequireAction action="venue.read">
      <TourPage />
    </RequireAction>
  );
}
