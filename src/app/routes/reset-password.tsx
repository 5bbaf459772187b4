import { useSearchParams } from 'react-router';
import { ResetPasswordForm } from '@/features/auth/components/reset-password-form';
import { PublicPage } from '../layout/public-page';

/** Public: the page the password e-mail links to (`/reset-password?token=...`). */
export function Component() {
  const [params] = useSearchParams();
  return (
    <PublicPage title="Choose a new password" heading="Choose a new password">
      <ResetPasswordForm token={params.get('token') ?? ''} />
    </PublicPage>
  );
}
