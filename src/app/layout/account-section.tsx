import { NavLink, useNavigate } from 'react-router-dom';
import { Button } from '../../components/ui/index.ts';
import { cx } from '../../lib/cx.ts';
import type { SessionUser } from '../../lib/session.ts';
import { useSignOut } from '../../features/auth/api/sign-out.ts';

/** Who is signed in, their account page, and signing out. */
export function AccountSection({ user }: { user: SessionUser }) {
  const signOut = useSignOut();
  const navigate = useNavigate();
  return (
    <div className="mt-auto border-t border-ink-100 px-4 py-4">
      <p className="truncate font-semibold text-ink-900">{user.name}</p>
      <p className="mb-3 truncate text-sm text-ink-600">{user.email}</p>
      <div className="flex flex-wrap gap-2">
        <NavLink
          to="/account"
          className={({ isActive }) =>
            cx('inline-flex min-h-9 items-center rounded-control px-3 text-sm font-semibold', isActive ? 'bg-tide-50 text-tide-800' : 'text-tide-700 hover:bg-tide-50')
          }
        >
          Account
        </NavLink>
        <Button
          variant="ghost"
          size="sm"
          loading={signOut.isPending}
          onClick={() => signOut.mutate(undefined, { onSettled: () => navigate('/sign-in', { replace: true }) })}
        >
          Sign out
        </Button>
      </div>
    </div>
  );
}
