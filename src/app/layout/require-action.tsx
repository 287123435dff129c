import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { Action } from '@domain/policy/index.ts';
import { buttonClasses, EmptyState } from '../../components/ui/index.ts';
import { useMay } from '../../lib/current-production.ts';

/**
 * Shows the screen only to people whose role may do `action`. The server refuses anyway; this
 * spares people a screen full of errors when they follow an old link.
 */
export function RequireAction({ action, children }: { action: Action; children: ReactNode }) {
  const may = useMay(action);
  if (may) return <>{children}</>;
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
