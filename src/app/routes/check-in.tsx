import { CheckInListPage } from '../../features/check-in/components/check-in-page.tsx';
import { RequireAction } from '../layout/require-action.tsx';

/** Lazy route module: `/p/:productionId/check-in` (planners, riggers, venue staff). */
export function Component() {
  return (
    <RequireAction action="engagement.checkin">
      <CheckInListPage />
    </RequireAction>
  );
}
