import type { ButtonHTMLAttributes } from 'react';
import { cx } from '../../lib/cx.ts';
import { Spinner } from './spinner.tsx';

export type ButtonVariant = 'primary' | 'secondary' | 'ghost' | 'danger';
export type ButtonSize = 'sm' | 'md';

interface ButtonLook {
  variant?: ButtonVariant;
  size?: ButtonSize;
  /** Full width: forms on phones. */
  block?: boolean;
}

const VARIANTS: Record<ButtonVariant, string> = {
  primary: 'bg-tide-600 text-white hover:bg-tide-700 active:bg-tide-800 disabled:bg-ink-300',
  secondary:
    'bg-white text-ink-900 border border-ink-300 hover:bg-ink-50 active:bg-ink-100 disabled:text-ink-400 disabled:bg-ink-50',
  ghost: 'bg-transparent text-tide-700 hover:bg-tide-50 active:bg-tide-100 disabled:text-ink-400',
  danger: 'bg-danger-600 text-white hover:bg-danger-700 active:bg-danger-800 disabled:bg-ink-300',
};

// Medium buttons are at least 44 px tall: a gloved thumb on a phone must hit them.
const SIZES: Record<ButtonSize, string> = {
  sm: 'min-h-9 px-3 text-sm',
  md: 'min-h-11 px-4 text-base',
};

/** Class names of a button, also for links that look like buttons. */
export function buttonClasses({ variant = 'primary', size = 'md', block = false }: ButtonLook = {}): string {
  return cx(
    'inline-flex items-center justify-center gap-2 rounded-control font-semibold transition-colors',
    'disabled:cursor-not-allowed',
    VARIANTS[variant],
    SIZES[size],
    block && 'w-full',
  );
}

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement>, ButtonLook {
  /** Shows a spinner and blocks clicks while an action runs. */
  loading?: boolean;
}

export function Button({ variant, size, block, loading = false, className, children, disabled, type = 'button', ...rest }: ButtonProps) {
  return (
    <button
      type={type}
      className={cx(buttonClasses({ variant, size, block }), className)}
      disabled={disabled || loading}
      aria-busy={loading || undefined}
      {...rest}
    >
      {loading && <Spinner size="sm" decorative />}
      {children}
    </button>
  );
}
