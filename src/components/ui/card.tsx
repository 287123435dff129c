import type { ReactNode } from 'react';
import { cx } from '../../lib/cx.ts';

export interface CardProps {
  /** Heading of the card (an h2). */
  title?: ReactNode;
  description?: ReactNode;
  /** Buttons or links at the heading's end. */
  actions?: ReactNode;
  className?: string;
  children?: ReactNode;
}

export function Card({ title, description, actions, className, children }: CardProps) {
  return (
    <section className={cx('rounded-panel border border-ink-200 bg-white shadow-panel', className)}>
      {(title || actions) && (
        <header className="flex flex-wrap items-start justify-between gap-3 border-b border-ink-100 px-4 py-3 sm:px-5">
          <div>
            {title && <h2 className="text-lg font-semibold text-ink-900">{title}</h2>}
            {description && <p className="text-sm text-ink-600">{description}</p>}
          </div>
          {actions && <div className="flex flex-wrap gap-2">{actions}</div>}
        </header>
      )}
      <div className="px-4 py-4 sm:px-5">{children}</div>
    </section>
  );
}
