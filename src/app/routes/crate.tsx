import { useParams } from 'react-router-dom';
import { CrateEditorPage } from '../../features/crates/components/crate-editor.tsx';
import { RequireAction } from '../layout/require-action.tsx';

/** Lazy route module: `/p/:productionId/crates/:crateId`. */
export function Component() {
  const { crateId = '' } = useParams();
  return (
    <RequireAction action="crate.read">
      <CrateEditorPage crateId={crateId} />
    </RequireAction>
  );
}
