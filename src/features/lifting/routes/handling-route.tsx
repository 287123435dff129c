import { HandlingPage } from '../components/handling-page.tsx';
import { Guard } from './guard.tsx';

/** Lazy route module: `/p/:productionId/lifting/handling`. */
export function Component() {
  return (
    <Guard action="gear.read">
      <HandlingPage />
    </Guard>
  );
}
