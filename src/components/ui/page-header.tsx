import type { ReactNode } from 'react';

export interface PageHeaderProps {
  title: ReactNode;
  /** A short line above the title, e.g. the production name. */
  eyebrow?: ReactNode;
  description?: ReactNode;
  actions?: ReactNode;
}

/** The h1 of a screen. Every screen has exactly one. */
export function PageHeader({ title, eyebrow, description, actions }: PageHeaderProps) {
  return (
    <header className="mb-6 flex flex-wrap items-end justify-between gap-4">
      {/* React hoists <title> into <head>: each screen names the browser tab. */}
      {typeof title === 'string' && <title>{`${title} · Ballast`}</title>}
      <div className="min-w-0">
        {eyebrow && <p className="text-sm font-semibold tracking-wide text-tide-700 uppercase">{eyebrow}</p>}
        <h1 className="text-2xl font-bold text-ink-950 sm:text-3xl">{title}</h1>
        {description && <p className="mt-1 max-w-prose text-ink-700">{description}</p>}
      </div>
      {actions && <div className="flex flex-wrap gap-2">{actions}</div>}
    </header>
  );
}
