import { cx } from '../../lib/cx.ts';

export interface SpinnerProps {
  size?: 'sm' | 'md' | 'lg';
  /** Read out to screen readers. */
  label?: string;
  /** Inside a button that already says what is happening: hidden from assistive tech. */
  decorative?: boolean;
  className?: string;
}

const SIZES = { sm: 'size-4', md: 'size-6', lg: 'size-10' } as const;

export function Spinner({ size = 'md', label = 'Loading…', decorative = false, className }: SpinnerProps) {
  const svg = (
    <svg className={cx('animate-spin', SIZES[size], className)} viewBox="0 0 24 24" fill="none" aria-hidden="true">
      <circle cx="12" cy="12" r="9" stroke="currentColor" strokeOpacity="0.25" strokeWidth="3" />
      <path d="M21 12a9 9 0 0 0-9-9" stroke="currentColor" strokeWidth="3" strokeLinecap="round" />
    </svg>
  );
  if (decorative) return svg;
  return (
    <span role="status" className="inline-flex items-center gap-2">
      {svg}
      <span className="sr-only">{label}</span>
    </span>
  );
}

/** A whole screen (or panel) waiting for data. */
export function PageLoading({ label = 'Loading…' }: { label?: string }) {
  return (
    <div className="flex min-h-48 flex-1 items-center justify-center p-8 text-tide-600">
      <Spinner size="lg" label={label} />
    </div>
  );
}
