import type { ReactNode } from 'react';
import { Logo } from '../../../components/ui/index.ts';

/** The frame of the public pages: the mark, one card with the page's heading, links below. */
export function AuthFrame({ title, intro, children, footer }: { title: ReactNode; intro?: ReactNode; children: ReactNode; footer?: ReactNode }) {
  return (
    <div className="flex min-h-dvh flex-col items-center bg-paper px-4 py-10 sm:justify-center">
      {typeof title === 'string' && <title>{`${title} · Ballast`}</title>}
      <div className="w-full max-w-md">
        <div className="mb-6 flex flex-col items-center gap-2 text-center">
          <Logo className="text-ink-950" />
          <p className="text-sm text-ink-600">Mass, lifting, crates and venues for touring machines</p>
        </div>
        <main className="rounded-panel border border-ink-200 bg-white px-5 py-6 shadow-panel sm:px-8">
          <h1 className="text-2xl font-bold text-ink-950">{title}</h1>
          {intro && <p className="mt-1 text-ink-700">{intro}</p>}
          <div className="mt-5">{children}</div>
        </main>
        {footer && <div className="mt-5 text-center text-ink-700">{footer}</div>}
      </div>
    </div>
  );
}

export const linkClasses = 'font-semibold text-tide-700 underline underline-offset-2 hover:text-tide-900';
