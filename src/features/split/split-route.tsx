import { EmptyState } from '../../components/ui/index.ts';
import { useMay } from '../../lib/current-production.ts';
import { SplitPage } from './components/split-page.tsx';

/** Lazy route module: `/p/:productionId/split`: the split advisor (roles with machine.read). */
export function Component() {
  if (!useMay('machine.read')) return <EmptyState title="This screen is not part of your role">Ask an administrator if you need it.</EmptyState>;
  return <SplitPage />;
}
