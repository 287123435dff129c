import { useState, type ReactNode } from 'react';
import { Link, useLocation } from 'react-router-dom';
import { Logo } from '../../components/ui/index.ts';
import { cx } from '../../lib/cx.ts';
import { useCurrentProduction } from '../../lib/current-production.ts';
import type { SessionUser } from '../../lib/session.ts';
import { AccountSection } from './account-section.tsx';
import { MainNav } from './main-nav.tsx';
import { ProductionSwitcher } from './production-switcher.tsx';

/**
 * The signed-in shell: a header, a side panel (switcher, navigation, account) and the screen.
 * On phones the side panel folds under a Menu button and closes when the page changes.
 */
export function AppLayout({ user, children }: { user: SessionUser; children: ReactNode }) {
  const location = useLocation();
  // Open "at" a path: navigating anywhere closes the menu without an effect.
  const [openAt, setOpenAt] = useState<string | null>(null);
  const open = openAt === location.pathname;
  const { membership } = useCurrentProduction();

  return (
    <div className="min-h-dvh bg-paper md:grid md:grid-cols-[16rem_1fr]">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-50 focus:rounded-control focus:bg-white focus:px-3 focus:py-2">
        Skip to content
      </a>
      <header className="sticky top-0 z-30 flex items-center gap-3 border-b border-ink-200 bg-white px-4 py-2 md:hidden">
        <button
          type="button"
          className="inline-flex min-h-11 items-center gap-2 rounded-control border border-ink-300 px-3 font-semibold text-ink-900"
          aria-expanded={open}
          aria-controls="side-panel"
          onClick={() => setOpenAt(open ? null : location.pathname)}
        >
          <svg viewBox="0 0 24 24" className="size-5" aria-hidden="true" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round">
            {open ? <path d="M6 6l12 12M18 6 6 18" /> : <path d="M4 7h16M4 12h16M4 17h16" />}
          </svg>
          Menu
        </button>
        <Link to="/" className="text-ink-950" aria-label="Ballast start">
          <Logo />
        </Link>
        {membership && <span className="ml-auto truncate text-sm font-semibold text-ink-700">{membership.productionName}</span>}
      </header>

      <aside
        id="side-panel"
        className={cx(
          'border-ink-200 bg-white md:sticky md:top-0 md:flex md:h-dvh md:flex-col md:overflow-y-auto md:border-r',
          open ? 'flex flex-col border-b' : 'hidden',
        )}
      >
        <div className="hidden px-5 pt-5 pb-3 md:block">
          <Link to="/" className="text-ink-950" aria-label="Ballast start">
            <Logo />
          </Link>
        </div>
        <div className="px-4 pt-4 md:pt-2">
          <ProductionSwitcher user={user} />
        </div>
        <MainNav user={user} />
        <AccountSection user={user} />
      </aside>

      <main id="main" tabIndex={-1} className="min-w-0 px-4 py-5 sm:px-6 md:px-8 md:py-8">
        <div className="mx-auto max-w-5xl">{children}</div>
      </main>
    </div>
  );
}
