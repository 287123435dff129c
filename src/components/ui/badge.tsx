import type { ReactNode } from 'react';
import { cx } from '../../lib/cx.ts';

export type Tone = 'neutral' | 'accent' | 'caution' | 'danger' | 'ok';

const TONES: Record<Tone, string> = {
  neutral: 'bg-ink-100 text-ink-800',
  accent: 'bg-tide-100 text-tide-800',
  caution: 'bg-caution-100 text-caution-800',
  danger: 'bg-danger-100 text-danger-800',
  ok: 'bg-ok-100 text-ok-800',
};

export function Badge({ tone = 'neutral', children, className }: { tone?: Tone; children: ReactNode; className?: string }) {
  return (
    <span className={cx('inline-flex items-center rounded-full px-2.5 py-0.5 text-sm font-semibold', TONES[tone], className)}>
      {children}
    </span>
  );
}
