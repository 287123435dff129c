import { useParams } from 'react-router-dom';
import { DocumentsCard } from '../../features/documents/components/documents-card.tsx';
import { OverviewPage } from '../../features/productions/components/overview-page.tsx';
import { RequireAction } from '../layout/require-action.tsx';

/** Lazy route module: `/p/:productionId`. */
export function Component() {
  const { productionId = '' } = useParams();
  return (
    <RequireAction action="production.read">
      <div className="flex flex-col gap-5">
        <OverviewPage />
        <DocumentsCard productionId={productionId} />
      </div>
    </RequireAction>
  );
}
