import { Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { PageLoading } from '../../../components/ui/index.ts';
import { safeNext } from '../../../lib/safe-next.ts';
import { useSession } from '../../../lib/session.ts';
import { AuthFrame } from './auth-frame.tsx';
import { SignInForm } from './sign-in-form.tsx';

export function SignInPage() {
  const session = useSession();
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const next = safeNext(params.get('next'));

  if (session.isPending) return <PageLoading />;
  if (session.data) return <Navigate to={next} replace />;

  return (
    <AuthFrame title="Sign in" intro="Use the e-mail address your administrator invited.">
      <SignInForm onSignedIn={() => navigate(next, { replace: true })} />
    </AuthFrame>
  );
}
