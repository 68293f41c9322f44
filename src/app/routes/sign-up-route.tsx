import { useNavigate } from 'react-router-dom';
import { SignUpForm } from '../../features/auth/components/sign-up-form';
import { paths } from '../paths';
import { PublicPage } from '../shell/public-layout';

export function SignUpRoute() {
  const navigate = useNavigate();
  return (
    <PublicPage
      title="Apply to join"
      lead="Tell the cooperative who you are and what you plan to grow. A coordinator reads each application and admits new members."
    >
      <SignUpForm onApplied={() => navigate(paths.applicationReceived(), { replace: true })} />
    </PublicPage>
  );
}
