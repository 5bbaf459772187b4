import { FileDown, Send, ShieldCheck } from 'lucide-react';
import { useState } from 'react';
import { toast } from 'sonner';
import { Button, buttonVariants } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { isReauthError, ReauthPassword } from '@/components/reauth-password';
import { errorMessage, type ApiError } from '@/lib/api-client';
import { formatMoney } from '@/lib/format';
import type { PayAppDetail } from '@/shared/schemas/pay-app';
import { useCertifyPayApp, useSubmitPayApp } from '../api/pay-app-actions';

type Ask = 'submit' | 'certify' | null;

/** Exports for everyone; Submit for the subcontractor on a draft; Certify for the general contractor when all lines are approved. */
export function PayAppCommands({ app }: { app: PayAppDetail }) {
  const [ask, setAskState] = useState<Ask>(null);
  const [reauth, setReauth] = useState<ApiError | null>(null);
  const [password, setPassword] = useState('');
  const [acknowledged, setAcknowledged] = useState<Set<string>>(new Set());
  const setAsk = (next: Ask) => {
    setAskState(next);
    setReauth(null);
    setPassword('');
    setAcknowledged(new Set());
  };
  const unacknowledged = ask === 'certify' ? app.flags.filter((f) => !acknowledged.has(f.key)).length : 0;
  const submit = useSubmitPayApp(app.id);
  const certify = useCertifyPayApp(app.id);
  const allApproved = app.lines.every((l) => l.reviewStatus === 'approved');
  const base = `/api/pay-apps/${encodeURIComponent(app.id)}`;
  const done = {
    onSuccess: () => {
      toast.success(
        ask === 'submit'
          ? 'Submitted; the general contractor has been told'
          : 'Certified; the owner has been asked for payment',
      );
      setAsk(null);
    },
    onError: (err: Error) => {
      // Certifying after a long session asks for the password again: keep the dialog open with a password field.
      if (isReauthError(err)) return setReauth(err);
      toast.error(errorMessage(err));
      setAsk(null);
    },
  };
  const run = () => {
    if (ask === 'submit') submit.mutate(app.revision, done);
    else
      certify.mutate(
        {
          expectedRevision: app.revision,
          reauthPassword: reauth ? password : undefined,
          acknowledgedFlags: [...acknowledged],
        },
        done,
      );
  };
  const pending = submit.isPending || certify.isPending;
  return (
    <div className="flex flex-wrap items-center gap-2">
      <a className={buttonVariants({ variant: 'secondary', size: 'md' })} href={`${base}/export.pdf`} download>
        <FileDown aria-hidden /> PDF
      </a>
      <a className={buttonVariants({ variant: 'secondary', size: 'md' })} href={`${base}/export.csv`} download>
        <FileDown aria-hidden /> CSV
      </a>
      {app.can.submit ? (
        <Button onClick={() => setAsk('submit')} disabled={submit.isPending}>
          <Send aria-hidden /> Submit{app.revision > 0 ? ` revision ${app.revision}` : ''}
        </Button>
      ) : null}
      {app.can.certify ? (
        <Button
          onClick={() => setAsk('certify')}
          disabled={!allApproved || certify.isPending}
          title={allApproved ? undefined : 'Approve every line first'}
        >
          <ShieldCheck aria-hidden /> Certify for payment
        </Button>
      ) : null}
      <Dialog
        open={ask !== null}
        onClose={() => setAsk(null)}
        title={ask === 'submit' ? `Submit pay application ${app.number}?` : `Certify pay application ${app.number}?`}
        description={
          ask === 'submit'
            ? 'The general contractor’s reviewers get an e-mail. You cannot edit it while it is under review.'
            : 'Certified applications are frozen; later corrections go into a new period or a change order.'
        }
      >
        <p className="text-sm">
          Current due <span className="font-semibold tabular-nums">{formatMoney(app.currentDueCents)}</span> for{' '}
          {app.periodStart} to {app.periodEnd}.
        </p>
        {ask === 'certify' && app.flags.length > 0 ? (
          <fieldset className="mt-3 flex flex-col gap-1.5 rounded-md border border-clay-200 bg-clay-50 p-3 text-sm">
            <legend className="px-1 font-semibold">Flags to acknowledge before money moves ({app.flags.length})</legend>
            {app.flags.map((f) => (
              <label key={f.key} className="flex items-start gap-2">
                <input
                  type="checkbox"
                  className="mt-1"
                  checked={acknowledged.has(f.key)}
                  onChange={(e) => {
                    const next = new Set(acknowledged);
                    if (e.target.checked) next.add(f.key);
                    else next.delete(f.key);
                    setAcknowledged(next);
                  }}
                />
                <span>
                  <span className="font-medium">{f.kind === 'beyond_band' ? 'Beyond the band' : 'No evidence'}:</span>{' '}
                  {f.message}
                </span>
              </label>
            ))}
            <span className="text-xs text-stone-600">Your acknowledgement is recorded with the certification.</span>
          </fieldset>
        ) : null}
        {reauth ? (
          <form
            id="certify-reauth"
            className="mt-3"
            onSubmit={(e) => {
              e.preventDefault();
              run();
            }}
          >
            <ReauthPassword value={password} onChange={setPassword} error={reauth} />
          </form>
        ) : null}
        <div className="mt-4 flex justify-end gap-2">
          <Button variant="secondary" onClick={() => setAsk(null)}>
            Cancel
          </Button>
          <Button onClick={run} disabled={pending || unacknowledged > 0 || (reauth !== null && password.length === 0)}>
            {ask === 'submit' ? 'Submit' : 'Certify'}
          </Button>
        </div>
      </Dialog>
    </div>
  );
}
