import { zodResolver } from '@hookform/resolvers/zod';
import { Send } from 'lucide-react';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { toast } from 'sonner';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { errorMessage } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { ROLE_LABELS } from '@/lib/labels';
import type { ProjectRole } from '@/shared/constants';
import { createInvitationSchema, type CreateInvitationInput } from '@/shared/schemas/invitation';
import { useInvite } from '../api/invitations';

/**
 * Invite someone of the admin's own company to its seat on the job by e-mail; the e-mail carries a one-time link
 * valid for 7 days. The seat is the company's (a subcontractor's admin fills the subcontractor seat), so it is shown,
 * not chosen.
 */
export function InviteForm({ projectId, seat }: { projectId: string; seat: ProjectRole }) {
  const invite = useInvite(projectId);
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<CreateInvitationInput>({
    resolver: zodResolver(createInvitationSchema),
    mode: 'onTouched',
    defaultValues: { email: '', role: seat },
  });
  const { errors, isSubmitting } = form.formState;
  const submit = form.handleSubmit(async (input) => {
    setFormError(null);
    try {
      const sent = await invite.mutateAsync(input);
      toast.success(`Invitation sent to ${sent.email}`);
      form.reset({ email: '', role: input.role });
    } catch (error) {
      const leftover = applyServerErrors(error, form.setError, ['email', 'role']);
      setFormError(leftover.length ? leftover.join('; ') : errorMessage(error));
    }
  });
  return (
    <form noValidate onSubmit={submit} aria-label="Invite someone" className="flex flex-wrap items-start gap-3">
      <Field label="E-mail" error={errors.email?.message} className="min-w-64 flex-1">
        {(control) => (
          <Input
            type="email"
            autoComplete="off"
            placeholder="name@company.com"
            {...control}
            {...form.register('email')}
          />
        )}
      </Field>
      <Field label="Role on this job" error={errors.role?.message} className="w-56">
        {(control) => <Input {...control} readOnly value={ROLE_LABELS[seat]} className="bg-stone-50" />}
      </Field>
      <Button type="submit" disabled={isSubmitting} className="mt-5">
        <Send aria-hidden />
        {isSubmitting ? 'Sending…' : 'Send invitation'}
      </Button>
      {formError ? <Alert className="w-full">{formError}</Alert> : null}
    </form>
  );
}
