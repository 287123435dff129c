import { useParams } from 'react-router-dom';
import { RunPage } from '../../features/loads/components/run-page.tsx';
import { RequireAction } from '../layout/require-action.tsx';

/** Lazy route module: `/p/:productionId/loads/:runId`: one packing run, its figures and its 3D view. */
export function Component() {
  const { runId = '' } = useParams();
  return (
    <RequireAction action="crate.read">
      <RunPage runId={runId} />
    </RequireAction>
  );
}
