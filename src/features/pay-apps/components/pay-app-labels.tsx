import { Badge } from '@/components/ui/badge';
import { formatDateRange } from '@/lib/format';
import type { LineReviewStatus, PayAppStatus } from '@/shared/constants';

/** Screen words for the API's status codes. */
export const PAY_APP_STATUS_LABELS: Record<PayAppStatus, string> = {
  draft: 'Draft',
  submitted: 'Submitted',
  in_review: 'In review',
  returned: 'Returned',
  certified: 'Certified',
  payment_processing: 'Payment in progress',
  partially_paid: 'Partly paid',
  paid: 'Paid',
};

const TONES: Record<PayAppStatus, 'neutral' | 'clay' | 'spruce' | 'brick'> = {
  draft: 'neutral',
  submitted: 'clay',
  in_review: 'clay',
  returned: 'brick',
  certified: 'spruce',
  payment_processing: 'spruce',
  partially_paid: 'spruce',
  paid: 'spruce',
};

export function PayAppStatusBadge({ status }: { status: PayAppStatus }) {
  return <Badge tone={TONES[status]}>{PAY_APP_STATUS_LABELS[status]}</Badge>;
}

const LINE: Record<LineReviewStatus, { label: string; tone: 'neutral' | 'spruce' | 'brick' }> = {
  pending: { label: 'Not reviewed', tone: 'neutral' },
  approved: { label: 'Approved', tone: 'spruce' },
  disputed: { label: 'Disputed', tone: 'brick' },
};

export function LineReviewBadge({ status }: { status: LineReviewStatus }) {
  return <Badge tone={LINE[status].tone}>{LINE[status].label}</Badge>;
}

export const periodText = formatDateRange;
