import { CheckInPage } from '../../features/check-in/components/check-in-page.tsx';
import { RequireAction } from '../layout/require-action.tsx';

/** Lazy route module: `/p/:productionId/check-in/:engagementId`, made for a phone. */
export function Component() {
  return (
    <RequireAction action="engagement.checkin">
      <CheckInPage />
    </RequireAction>
  );
}
