import { ForgotPasswordForm } from '../../features/auth/components/forgot-password-form';
import { PublicPage } from '../shell/public-layout';

export function ForgotPasswordRoute() {
  return (
    <PublicPage title="Forgot your password?">
      <ForgotPasswordForm />
    </PublicPage>
  );
}
