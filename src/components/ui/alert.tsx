import type { ReactNode } from 'react';
import { cx } from '../../lib/cx.ts';
import type { Tone } from './badge.tsx';

const TONES: Record<Tone, string> = {
  neutral: 'border-ink-300 bg-ink-50 text-ink-900',
  accent: 'border-tide-300 bg-tide-50 text-tide-900',
  caution: 'border-caution-300 bg-caution-50 text-caution-800',
  danger: 'border-danger-300 bg-danger-50 text-danger-800',
  ok: 'border-ok-300 bg-ok-50 text-ok-800',
};

export interface AlertProps {
  tone?: Tone;
  title?: ReactNode;
  children?: ReactNode;
  actions?: ReactNode;
  className?: string;
}

/** A message in a box. Danger and caution interrupt screen readers; the rest are polite. */
export function Alert({ tone = 'neutral', title, children, actions, className }: AlertProps) {
  return (
    <div
      role={tone === 'danger' || tone === 'caution' ? 'alert' : 'status'}
      className={cx('rounded-control border-l-4 border px-4 py-3', TONES[tone], className)}
    >
      {title && <p className="font-semibold">{title}</p>}
      {children && <div className={title ? 'mt-1' : undefined}>{children}</div>}
      {actions && <div className="mt-3 flex flex-wrap gap-2">{actions}</div>}
    </div>
  );
}
