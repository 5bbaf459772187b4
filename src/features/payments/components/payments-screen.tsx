import { useSearchParams } from 'react-router';
import { Alert } from '@/components/ui/alert';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import type { ProjectPaymentsView } from '@/shared/schemas/payment';
import { useProjectPayments } from '../api/get-payments';
import { FeeBearerCard } from './fee-bearer-card';
import { PayAppPaymentsCard } from './pay-app-payments-card';
import { PaymentHistory } from './payment-history';

/** What the owner sees on coming back from checkout, from the payment's own state (the webhook's, not the URL's). */
function ReturnNotice({ data }: { data: ProjectPaymentsView }) {
  const [params] = useSearchParams();
  const payment = data.payments.find((p) => p.id === params.get('payment'));
  if (!payment) return null;
  if (params.get('result') === 'canceled' && payment.status === 'created')
    return <Alert>Checkout was left without paying. Nothing was charged.</Alert>;
  if (payment.status === 'succeeded')
    return <Alert tone="success">Payment received. Receipts are on their way by e-mail.</Alert>;
  if (payment.status === 'processing')
    return <Alert tone="success">Bank debit started. It shows “Processing” until the bank confirms it.</Alert>;
  if (payment.status === 'failed')
    return (
      <Alert>
        The payment did not go through: {payment.failureMessage}. The balance is open again; you can pay it below.
      </Alert>
    );
  if (payment.status === 'created')
    return <Alert tone="success">Waiting for the processor to confirm the payment…</Alert>;
  return null;
}

export function PaymentsScreen({
  projectId,
  canPay,
  canManageContract,
}: {
  projectId: string;
  canPay: boolean;
  /** The general contractor's side: sets who bears processing fees. */
  canManageContract: boolean;
}) {
  const query = useProjectPayments(projectId);
  if (query.isPending) return <LoadingState label="Loading payments…" />;
  if (query.isError) return <ErrorState error={query.error} onRetry={() => void query.refetch()} />;
  const data = query.data;
  return (
    <div className="flex flex-col gap-5">
      <ReturnNotice data={data} />
      {data.payApps.length === 0 ? (
        <EmptyState title="No certified pay applications yet">
          Once the general contractor certifies an application,{' '}
          {canPay ? 'you can pay it here by card or ACH.' : 'the owner can pay it here.'}
        </EmptyState>
      ) : (
        <div className="flex flex-col gap-4">
          {data.payApps.map((a) => (
            <PayAppPaymentsCard key={a.id} payApp={a} payments={data.payments} canPay={canPay} />
          ))}
        </div>
      )}
      <section aria-labelledby="payments-history" className="flex flex-col gap-2">
        <h2 id="payments-history" className="text-sm font-semibold">
          Payment history
        </h2>
        <PaymentHistory payments={data.payments} />
      </section>
      <FeeBearerCard projectId={projectId} bearer={data.feeBearer} rates={data.feeRates} canEdit={canManageContract} />
    </div>
  );
}
