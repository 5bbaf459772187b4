import { CheckCircle2, CircleX, Clock } from 'lucide-react';
import { Badge } from '@/components/ui/badge';
import type { PaymentStatus } from '@/shared/constants';
import { PAYMENT_STATUS_LABELS, PAYMENT_STATUS_TONES } from './labels';

const ICONS: Partial<Record<PaymentStatus, typeof Clock>> = {
  processing: Clock,
  succeeded: CheckCircle2,
  failed: CircleX,
};

export function PaymentStatusBadge({ status }: { status: PaymentStatus }) {
  const Icon = ICONS[status];
  return (
    <Badge tone={PAYMENT_STATUS_TONES[status]} data-status={status}>
      {Icon ? <Icon aria-hidden className="size-3" /> : null}
      {PAYMENT_STATUS_LABELS[status]}
    </Badge>
  );
}
