import { ErrorState, LoadingState } from '@/components/ui/states';
import { useProjectPayments } from '../api/get-payments';
import { PayAppPaymentsCard } from './pay-app-payments-card';

/** The payment card of one certified application, on the application itself: the owner pays from here. */
export function PayAppPaymentPanel({
  projectId,
  payAppId,
  canPay,
}: {
  projectId: string;
  payAppId: string;
  canPay: boolean;
}) {
  const query = useProjectPayments(projectId);
  if (query.isPending) return <LoadingState label="Loading the payments…" />;
  if (query.isError) return <ErrorState error={query.error} onRetry={() => void query.refetch()} />;
  const payApp = query.data.payApps.find((a) => a.id === payAppId);
  return payApp ? <PayAppPaymentsCard payApp={payApp} payments={query.data.payments} canPay={canPay} /> : null;
}
