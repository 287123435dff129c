import type { ReactNode } from 'react';
import { errorMessage } from '../../lib/api.ts';
import { cx } from '../../lib/cx.ts';
import { Button } from './button.tsx';

export interface ErrorStateProps {
  title?: ReactNode;
  error?: unknown;
  /** Offers "Try again" when given. */
  onRetry?: () => void;
  retrying?: boolean;
  action?: ReactNode;
  className?: string;
}

/** Something failed to load: say what, and offer a way on. */
export function ErrorState({ title = 'This could not be loaded', error, onRetry, retrying, action, className }: ErrorStateProps) {
  return (
    <div role="alert" className={cx('flex flex-col items-start gap-3 rounded-panel border border-danger-300 bg-danger-50 px-5 py-5', className)}>
      <h2 className="text-lg font-semibold text-danger-800">{title}</h2>
      {error !== undefined && <p className="text-danger-800">{errorMessage(error)}</p>}
      {(onRetry || action) && (
        <div className="flex flex-wrap gap-2">
          {onRetry && (
            <Button variant="secondary" onClick={onRetry} loading={retrying}>
              Try again
            </Button>
          )}
          {action}
        </div>
      )}
    </div>
  );
}
