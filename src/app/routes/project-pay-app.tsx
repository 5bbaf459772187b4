import { useParams, type LoaderFunctionArgs } from 'react-router';
import { payAppQueryOptions } from '@/features/pay-apps/api/get-pay-apps';
import { PayAppDetailScreen } from '@/features/pay-apps/components/pay-app-detail';
import { PayAppPaymentPanel } from '@/features/payments/components/pay-app-payment-panel';
import { useProject } from '@/features/projects/api/get-project';
import { prefetchWhenSignedIn } from '../prefetch';

export function loader({ params }: LoaderFunctionArgs) {
  prefetchWhenSignedIn(payAppQueryOptions(params.payAppId ?? ''));
  return null;
}

export function Component() {
  const { projectId = '', payAppId = '' } = useParams();
  const project = useProject(projectId);
  return (
    <>
      <title>{`${project.name} · Pay application · Tallyard`}</title>
      <PayAppDetailScreen
        payAppId={payAppId}
        payment={<PayAppPaymentPanel projectId={projectId} payAppId={payAppId} canPay={project.can.pay} />}
      />
    </>
  );
}
