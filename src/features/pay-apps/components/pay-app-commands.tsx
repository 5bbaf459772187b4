import { FileDown, Send, ShieldCheck } from 'lucide-react';
import { useState } from 'react';
import { toast } from 'sonner';
import { Button, buttonVariants } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { errorMessage } from '@/lib/api-client';
import { formatMoney } from '@/lib/format';
import type { PayAppDetail } from '@/shared/schemas/pay-app';
import { useCertifyPayApp, useSubmitPayApp } from '../api/pay-app-actions';

type Ask = 'submit' | 'certify' | null;

/** Exports for everyone; Submit for the subcontractor on a draft; Certify for the general contractor when all lines are approved. */
export function PayAppCommands({ app, isSub, isGc }: { app: PayAppDetail; isSub: boolean; isGc: boolean }) {
  const [ask, setAsk] = useState<Ask>(null);
  const submit = useSubmitPayApp(app.id);
  const certify = useCertifyPayApp(app.id);
  const allApproved = app.lines.every((l) => l.reviewStatus === 'approved');
  const canCertify = isGc && (app.status === 'submitted' || app.status === 'in_review');
  const base = `/api/pay-apps/${encodeURIComponent(app.id)}`;
  const run = () => {
    const mutation = ask === 'submit' ? submit : certify;
    mutation.mutate(app.revision, {
      onSuccess: () => toast.success(ask === 'submit' ? 'Submitted; the general contractor has been told' : 'Certified; the owner has been asked for payment'),
      onError: (err) => toast.error(errorMessage(err)),
    });
    setAsk(null);
  };
  return (
    <div className="flex flex-wrap items-center gap-2">
      <a className={buttonVariants({ variant: 'secondary', size: 'md' })} href={`${base}/export.pdf`} download>
        <FileDown aria-hidden /> PDF
      </a>
      <a className={buttonVariants({ variant: 'secondary', size: 'md' })} href={`${base}/export.csv`} download>
        <FileDown aria-hidden /> CSV
      </a>
      {isSub && app.status === 'draft' ? (
        <Button onClick={() => setAsk('submit')} disabled={submit.isPending}>
          <Send aria-hidden /> Submit{app.revision > 0 ? ` revision ${app.revision}` : ''}
        </Button>
      ) : null}
      {canCertify ? (
        <Button onClick={() => setAsk('certify')} disabled={!allApproved || certify.isPending} title={allApproved ? undefined : 'Approve every line first'}>
          <ShieldCheck aria-hidden /> Certify for payment
        </Button>
      ) : null}
      <Dialog
        open={ask !== null}
        onClose={() => setAsk(null)}
        title={ask === 'submit' ? `Submit pay application ${app.number}?` : `Certify pay application ${app.number}?`}
        description={ask === 'submit' ? 'The general contractor’s reviewers get an e-mail. You cannot edit it while it is under review.' : 'Certified applications are frozen; later corrections go into a new period or a change order.'}
      >
        <p className="text-sm">
          Current due <span className="font-semibold tabular-nums">{formatMoney(app.currentDueCents)}</span> for {app.periodStart} to {app.periodEnd}.
        </p>
        <div className="mt-4 flex justify-end gap-2">
          <Button variant="secondary" onClick={() => setAsk(null)}>Cancel</Button>
          <Button onClick={run}>{ask === 'submit' ? 'Submit' : 'Certify'}</Button>
        </div>
      </Dialog>
    </div>
  );
}
