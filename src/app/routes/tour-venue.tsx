import { VenuePage } from '../../features/tour/components/venue-page.tsx';
import { RequireAction } from '../layout/require-action.tsx';

/** Lazy route module: `/p/:productionId/tour/venues/:venueId` (venue staff: their own venue). */
export function Component() {
  return (
    <RequireAction action="venue.read">
      <VenuePage />
    </RequireAction>
  );
}
