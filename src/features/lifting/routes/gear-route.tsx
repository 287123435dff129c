import { GearPage } from '../components/gear-page.tsx';
import { Guard } from './guard.tsx';

/** Lazy route module: `/p/:productionId/lifting/gear`. */
export function Component() {
  return (
    <Guard action="gear.read">
      <GearPage />
    </Guard>
  );
}
