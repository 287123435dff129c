import { EmptyState } from '../../components/ui/index.ts';
import { useMay } from '../../lib/current-production.ts';
import { ImpactPage } from './components/impact-page.tsx';

/** Lazy route module: `/p/:productionId/impact`: try a change as a draft and see what it breaks. */
export function Component() {
  if (!useMay('machine.read')) return <EmptyState title="This screen is not part of your role">Ask an administrator if you need it.</EmptyState>;
  return <ImpactPage />;
}
