import type { ReactNode } from 'react';
import { cx } from '../../lib/cx.ts';

export interface EmptyStateProps {
  title: ReactNode;
  children?: ReactNode;
  /** What the person can do next. */
  action?: ReactNode;
  className?: string;
}

/** Nothing to show yet, said kindly, with the next step. */
export function EmptyState({ title, children, action, className }: EmptyStateProps) {
  return (
    <div className={cx('flex flex-col items-center gap-3 rounded-panel border border-dashed border-ink-300 px-6 py-10 text-center', className)}>
      <svg viewBox="0 0 48 48" className="size-12 text-ink-300" aria-hidden="true" fill="none" stroke="currentColor" strokeWidth="2.5">
        <rect x="8" y="16" width="32" height="24" rx="3" />
        <path d="M8 24h32M18 16l3-8h6l3 8" strokeLinejoin="round" />
      </svg>
      <h2 className="text-lg font-semibold text-ink-900">{title}</h2>
      {children && <div className="max-w-prose text-ink-700">{children}</div>}
      {action && <div className="mt-1">{action}</div>}
    </div>
  );
}
