import { PlanPage } from '../components/plan-page.tsx';
import { Guard } from './guard.tsx';

/** Lazy route module: `/p/:productionId/lifting/plans/:planId`. */
export function Component() {
  return (
    <Guard action="liftplan.read">
      <PlanPage />
    </Guard>
  );
}
