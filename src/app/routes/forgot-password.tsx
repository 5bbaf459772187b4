import { ForgotPasswordForm } from '@/features/auth/components/forgot-password-form';
import { PublicPage } from '../layout/public-page';

/** Public: asks for a link to choose a new password. */
export function Component() {
  return (
    <PublicPage title="Forgot your password" heading="Forgot your password?">
      <ForgotPasswordForm />
    </PublicPage>
  );
}
