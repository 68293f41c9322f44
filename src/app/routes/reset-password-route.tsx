import { useSearchParams } from 'react-router-dom';
import { ResetPasswordForm } from '../../features/auth/components/reset-password-form';
import { PublicPage } from '../shell/public-layout';

export function ResetPasswordRoute() {
  const [params] = useSearchParams();
  // The e-mailed link arrives as ?token=… or, when it has expired, as ?error=INVALID_TOKEN.
  const token = params.get('error') ? null : params.get('token');
  return (
    <PublicPage title="Set a new password">
      <ResetPasswordForm token={token} />
    </PublicPage>
  );
}
