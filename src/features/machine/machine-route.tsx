import { Link } from 'react-router-dom';
import { buttonClasses, EmptyState } from '../../components/ui/index.ts';
import { useMay } from '../../lib/current-production.ts';
import { MachinePage } from './components/machine-page.tsx';

/** Lazy route module: `/p/:productionId/machine` (roles with machine.read). */
export function Component() {
  const may = useMay('machine.read');
  if (!may) {
    return (
      <EmptyState
        title="This screen is not part of your role"
        action={
          <Link to="/" className={buttonClasses({ variant: 'secondary' })}>
            Go to the start
          </Link>
        }
      >
        Ask an administrator if you need it.
      </EmptyState>
    );
  }
  return <MachinePage />;
}
