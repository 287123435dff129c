import { ArchivesPage } from '../../features/admin/components/archives-page.tsx';
import { RequireAction } from '../layout/require-action.tsx';

/** Lazy route module: `/admin/archives` (administrators). */
export function Component() {
  return (
    <RequireAction action="production.archive">
      <ArchivesPage />
    </RequireAction>
  );
}
