import { Link } from 'react-router-dom';
import { LIFTING_CAUTIONS } from '@domain/lifting/index.ts';
import { buttonClasses, Card, EmptyState, ErrorState, PageHeader, PageLoading } from '../../../components/ui/index.ts';
import { useCurrentProduction, useMay } from '../../../lib/current-production.ts';
import { usePlans } from '../api/plans.ts';
import { PlanVerdictBadge, StatusBadge } from './badges.tsx';
import { CautionsPanel } from './cautions-panel.tsx';

/** `/p/:productionId/lifting`: the lift plans, with ways to the handling verdicts and the gear. */
export function LiftingPage() {
  const { productionId } = useCurrentProduction();
  const plans = usePlans(productionId ?? '');
  const mayEdit = useMay('liftplan.edit');
  const mayGear = useMay('gear.read');
  // Handling covers every item, not one venue's: the same people who see the gear.
  const mayHandling = mayGear;
  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        eyebrow="Lifting"
        title="Lift plans"
        description="Each plan is checked by the server with Ballast's lifting core on today's section figures and gear, and signed off by a rigger who did not write it."
        actions={
          <>
            {mayHandling && (
              <Link to="handling" className={buttonClasses({ variant: 'secondary' })}>
                Manual handling
              </Link>
            )}
            {mayGear && (
              <Link to="gear" className={buttonClasses({ variant: 'secondary' })}>
                Rigging gear
              </Link>
            )}
            {mayEdit && (
              <Link to="plans/new" className={buttonClasses()}>
                New lift plan
              </Link>
            )}
          </>
        }
      />
      <CautionsPanel cautions={LIFTING_CAUTIONS} />
      {plans.isPending ? (
        <PageLoading />
      ) : plans.isError ? (
        <ErrorState title="The lift plans could not be loaded" error={plans.error} onRetry={() => plans.refetch()} retrying={plans.isFetching} />
      ) : plans.data.length === 0 ? (
        <EmptyState title="No lift plans yet">{mayEdit ? 'Start one for a section that goes up on a hoist.' : 'Planners and riggers write them.'}</EmptyState>
      ) : (
        <Card>
          <div className="overflow-x-auto">
            <table className="w-full text-left">
              <thead className="text-sm text-ink-600">
                <tr>
                  <th className="py-2 pr-3">Plan</th>
                  <th className="py-2 pr-3">Section</th>
                  <th className="py-2 pr-3">Lift date</th>
                  <th className="py-2 pr-3">Status</th>
                  <th className="py-2 pr-3">Verdict</th>
                  <th className="py-2">Author</th>
                </tr>
              </thead>
              <tbody>
                {plans.data.map((p) => (
                  <tr key={p.id} className="border-t border-ink-100">
                    <td className="py-2 pr-3">
                      <Link to={`plans/${p.id}`} className="font-semibold text-tide-700 underline-offset-2 hover:underline">
                        {p.title}
                      </Link>
                    </td>
                    <td className="py-2 pr-3">{p.sectionCode ?? '—'}</td>
                    <td className="py-2 pr-3">{p.liftDate}</td>
                    <td className="py-2 pr-3">
                      <StatusBadge status={p.status} />
                    </td>
                    <td className="py-2 pr-3">
                      <PlanVerdictBadge verdict={p.verdict} problemCount={p.problemCount} />
                    </td>
                    <td className="py-2">{p.authorName ?? '—'}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </Card>
      )}
    </div>
  );
}
