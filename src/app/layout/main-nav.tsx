import type { ReactNode } from 'react';
import { NavLink } from 'react-router-dom';
import { Badge } from '../../components/ui/index.ts';
import { cx } from '../../lib/cx.ts';
import { ROLE_LABEL } from '../../lib/roles.ts';
import type { SessionUser } from '../../lib/session.ts';
import { navigationFor, type NavLinkTarget } from '../navigation.ts';
import { useNavProduction } from './use-nav-production.ts';

/** The navigation that fits the person's role in the current production, and their company rights. */
export function MainNav({ user }: { user: SessionUser }) {
  const { productionId, role } = useNavProduction();
  const { production, company } = navigationFor({ productionId, role, isAdmin: user.isAdmin });
  return (
    <nav aria-label="Main" className="flex flex-col gap-5 px-3 py-4">
      {production.length > 0 && role && (
        <Group
          title={
            <span className="flex items-center justify-between gap-2">
              This production <Badge tone="accent" className="tracking-normal normal-case">{ROLE_LABEL[role]}</Badge>
            </span>
          }
          links={production}
        />
      )}
      {company.length > 0 && <Group title="Company" links={company} />}
    </nav>
  );
}

function Group({ title, links }: { title: ReactNode; links: NavLinkTarget[] }) {
  return (
    <div>
      <div className="mb-1.5 px-2 text-xs font-semibold tracking-wider text-ink-600 uppercase">{title}</div>
      <ul className="flex flex-col gap-0.5">
        {links.map((link) => (
          <li key={link.to}>
            <NavLink
              to={link.to}
              end={link.end}
              className={({ isActive }) =>
                cx(
                  'flex min-h-11 items-center rounded-control px-3 font-semibold',
                  isActive ? 'bg-tide-50 text-tide-800 shadow-[inset_3px_0_0_var(--color-tide-600)]' : 'text-ink-800 hover:bg-ink-50',
                )
              }
            >
              {link.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </div>
  );
}
