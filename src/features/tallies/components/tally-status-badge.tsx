import { Badge } from '@/components/ui/badge';
import type { TallyStatus } from '@/shared/constants';
import { TALLY_STATUS_LABELS, TALLY_STATUS_TONES } from './tally-labels';

export function TallyStatusBadge({ status }: { status: TallyStatus }) {
  return <Badge tone={TALLY_STATUS_TONES[status]}>{TALLY_STATUS_LABELS[status]}</Badge>;
}
