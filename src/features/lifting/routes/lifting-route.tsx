import { LiftingPage } from '../components/lifting-page.tsx';
import { Guard } from './guard.tsx';

/** Lazy route module: `/p/:productionId/lifting`. */
export function Component() {
  return (
    <Guard action="liftplan.read">
      <LiftingPage />
    </Guard>
  );
}
