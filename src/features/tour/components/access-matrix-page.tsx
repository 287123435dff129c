import { Link } from 'react-router-dom';
import { Button, ErrorState, PageHeader, PageLoading } from '../../../components/ui/index.ts';
import { useCurrentProduction } from '../../../lib/current-production.ts';
import { useAccessMatrix } from '../api/get-access-matrix.ts';
import { AccessMatrix } from './access-matrix.tsx';

/** `/p/:productionId/tour/matrix`: every crate and section against every venue of the tour. */
export function AccessMatrixPage() {
  const { productionId, membership } = useCurrentProduction();
  const matrix = useAccessMatrix(productionId ?? '');
  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        eyebrow={membership?.productionName}
        title="Access matrix"
        description="Every crate and section against every venue of the tour: doors (upright, and tilted where allowed), freight lift, floor, dock and ramps. A check with data missing gives no verdict."
        actions={
          <>
            <Link to=".." relative="path" className="self-center text-tide-700 underline">
              Back to the tour
            </Link>
            <Button variant="secondary" onClick={() => matrix.refetch()} loading={matrix.isFetching && !matrix.isPending}>
              Check again
            </Button>
          </>
        }
      />
      {matrix.isPending ? (
        <PageLoading />
      ) : matrix.isError ? (
        <ErrorState title="The access matrix could not be loaded" error={matrix.error} onRetry={() => matrix.refetch()} retrying={matrix.isFetching} />
      ) : (
        <AccessMatrix matrix={matrix.data} />
      )}
    </div>
  );
}
