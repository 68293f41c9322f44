import { Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { useMe } from '../../features/auth/api/get-me';
import { SignInForm } from '../../features/auth/components/sign-in-form';
import { safeNext } from '../paths';
import { PublicPage } from '../shell/public-layout';

export function SignInRoute() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const me = useMe();
  const next = safeNext(params.get('next'));

  // Someone already signed in has no business here; take them where they were going.
  if (me.data) return <Navigate to={next} replace />;

  return (
    <PublicPage title="Sign in" lead="For members and coordinators of the cooperative.">
      <SignInForm onSignedIn={() => navigate(next, { replace: true })} />
    </PublicPage>
  );
}
