import { LoadsPage } from '../../features/loads/components/loads-page.tsx';
import { RequireAction } from '../layout/require-action.tsx';

/** Lazy route module: `/p/:productionId/loads`: vehicles and packing runs. */
export function Component() {
  return (
    <RequireAction action="crate.read">
      <LoadsPage />
    </RequireAction>
  );
}
