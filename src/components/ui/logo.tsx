import { cx } from '../../lib/cx.ts';

/** The Ballast mark: a weight block resting on a line, with the word beside it. */
export function Logo({ className, withWord = true }: { className?: string; withWord?: boolean }) {
  return (
    <span className={cx('inline-flex items-center gap-2 font-bold tracking-tight', className)}>
      <svg viewBox="0 0 32 32" className="size-8 shrink-0" aria-hidden="true">
        <rect width="32" height="32" rx="7" fill="var(--color-tide-600)" />
        <path d="M9 23h14l-2.5-11h-9z" fill="#fff" />
        <circle cx="16" cy="9" r="2.6" fill="none" stroke="#fff" strokeWidth="2" />
        <path d="M6 25.5h20" stroke="var(--color-caution-300)" strokeWidth="2" strokeLinecap="round" />
      </svg>
      {withWord && <span className="text-xl">Ballast</span>}
    </span>
  );
}
