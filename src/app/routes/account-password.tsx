import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { ChangePasswordForm } from '@/features/auth/components/change-password-form';

/** The signed-in person's password. */
export function Component() {
  return (
    <div className="mx-auto max-w-7xl px-4 pt-4 pb-10">
      <title>Password · Tallyard</title>
      <PageHeader
        title="Your password"
        subtitle="Changing it signs you out in every other browser and on every other device."
      />
      <Card className="max-w-md p-6">
        <ChangePasswordForm />
      </Card>
    </div>
  );
}
