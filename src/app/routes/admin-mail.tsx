import { MailPage } from '../../features/admin/components/mail-page.tsx';
import { RequireAction } from '../layout/require-action.tsx';

/** Lazy route module: `/admin/mail` (administrators). */
export function Component() {
  return (
    <RequireAction action="mail.read">
      <MailPage />
    </RequireAction>
  );
}
