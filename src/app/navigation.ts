import { roleMay, type Action, type ProductionRole } from '@domain/policy/index.ts';

/**
 * Every navigation entry of the app, in order. Later features add one line each; who sees an
 * entry is decided by the policy (`roleMay`), never by a list of roles here.
 *
 * - `scope: 'production'`: `path` is relative to the current production (`/p/:productionId/<path>`;
 *   '' is the production's overview).
 * - `scope: 'company'`: `path` is absolute; used for company-wide (admin) screens.
 */
export interface NavItem {
  label: string;
  path: string;
  action: Action;
  scope: 'production' | 'company';
}

export const NAV_ITEMS: readonly NavItem[] = [
  { label: 'Overview', path: '', action: 'production.read', scope: 'production' },
  { label: 'Machine', path: 'machine', action: 'machine.read', scope: 'production' },
  { label: 'Lifting', path: 'lifting', action: 'liftplan.read', scope: 'production' },
  { label: 'Crates & loads', path: 'crates', action: 'crate.read', scope: 'production' },
  { label: 'Split advisor', path: 'split', action: 'machine.read', scope: 'production' },
  { label: 'Impact', path: 'impact', action: 'machine.read', scope: 'production' },
  { label: 'Tour & venues', path: 'tour', action: 'venue.read', scope: 'production' },
  { label: 'Check-in', path: 'check-in', action: 'engagement.checkin', scope: 'production' },
  { label: 'Settings', path: 'settings', action: 'production.settings.edit', scope: 'production' },
  { label: 'People', path: '/admin/people', action: 'people.manage', scope: 'company' },
  { label: 'Mail', path: '/admin/mail', action: 'mail.read', scope: 'company' },
  { label: 'Archives', path: '/admin/archives', action: 'production.archive', scope: 'company' },
];

export interface NavLinkTarget {
  label: string;
  /** Absolute path to link to. */
  to: string;
  /** Exact match only (the overview, so it is not "active" on every production page). */
  end: boolean;
  item: NavItem;
}

/** A production-scoped path under a production. */
export function productionPath(productionId: string, path = ''): string {
  return `/p/${encodeURIComponent(productionId)}${path ? `/${path}` : ''}`;
}

/**
 * The entries a person sees: production entries only inside a production they belong to, each
 * filtered by what their role there may do; company entries by their company-wide rights.
 */
export function navigationFor(
  ctx: { productionId: string | null; role: ProductionRole | null; isAdmin: boolean },
  items: readonly NavItem[] = NAV_ITEMS,
): { production: NavLinkTarget[]; company: NavLinkTarget[] } {
  const production: NavLinkTarget[] = [];
  const company: NavLinkTarget[] = [];
  for (const item of items) {
    if (!roleMay(ctx.role, ctx.isAdmin, item.action)) continue;
    if (item.scope === 'production') {
      if (!ctx.productionId || !ctx.role) continue;
      production.push({ label: item.label, to: productionPath(ctx.productionId, item.path), end: item.path === '', item });
    } else {
      company.push({ label: item.label, to: item.path, end: false, item });
    }
  }
  return { production, company };
}

/**
 * Where to land when switching to another production: the same screen if the role there may
 * see it, else that production's overview.
 */
export function switchTarget(
  pathname: string,
  toProductionId: string,
  toRole: ProductionRole,
  isAdmin: boolean,
  items: readonly NavItem[] = NAV_ITEMS,
): string {
  const match = /^\/p\/[^/]+\/?(.*)$/.exec(pathname);
  const rest = match?.[1] ?? '';
  const section = rest.split('/')[0] ?? '';
  const item = items.find((i) => i.scope === 'production' && i.path === section && section !== '');
  // Only the top level of a screen carries over: an id deeper in the path belongs to the old production.
  return item && roleMay(toRole, isAdmin, item.action) ? productionPath(toProductionId, item.path) : productionPath(toProductionId);
}
