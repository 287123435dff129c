import { PeoplePage } from '../../features/admin/components/people-page.tsx';
import { RequireAction } from '../layout/require-action.tsx';

/** Lazy route module: `/admin/people` (administrators). */
export function Component() {
  return (
    <RequireAction action="people.manage">
      <PeoplePage />
    </RequireAction>
  );
}
