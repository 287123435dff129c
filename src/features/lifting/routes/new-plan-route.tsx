import { NewPlanPage } from '../components/new-plan-page.tsx';
import { Guard } from './guard.tsx';

/** Lazy route module: `/p/:productionId/lifting/plans/new`. */
export function Component() {
  return (
    <Guard action="liftplan.edit">
      <NewPlanPage />
    </Guard>
  );
}
