import type { ReactNode } from 'react';
import type { Action } from '@domain/policy/index.ts';
import { EmptyState } from '../../../components/ui/index.ts';
import { useMay } from '../../../lib/current-production.ts';

/** Shows a lifting screen only to roles that may use it (the server refuses anyway). */
export function Guard({ action, children }: { action: Action; children: ReactNode }) {
  if (useMay(action)) return <>{children}</>;
  return <EmptyState title="This screen is not part of your role">Ask an administrator if you need it.</EmptyState>;
}
