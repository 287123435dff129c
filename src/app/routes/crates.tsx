import { CratesPage } from '../../features/crates/components/crates-page.tsx';
import { RequireAction } from '../layout/require-action.tsx';

/** Lazy route module: `/p/:productionId/crates` (planners edit, riggers read). */
export function Component() {
  return (
    <RequireAction action="crate.read">
      <CratesPage />
    </RequireAction>
  );
}
