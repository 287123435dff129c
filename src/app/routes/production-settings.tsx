import { SettingsPage } from '../../features/productions/components/settings-page.tsx';
import { RequireAction } from '../layout/require-action.tsx';

/** Lazy route module: `/p/:productionId/settings` (planners). */
export function Component() {
  return (
    <RequireAction action="production.settings.edit">
      <SettingsPage />
    </RequireAction>
  );
}
