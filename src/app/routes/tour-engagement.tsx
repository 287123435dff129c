import { EngagementPage } from '../../features/tour/components/engagement-page.tsx';
import { RequireAction } from '../layout/require-action.tsx';

/** Lazy route module: `/p/:productionId/tour/engagements/:engagementId`. */
export function Component() {
  return (
    <RequireAction action="engagement.read">
      <EngagementPage />
    </RequireAction>
  );
}
