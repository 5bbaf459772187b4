import { Badge } from '@/components/ui/badge';
import type { WatchStatus } from '@/shared/schemas/variance';

/** Palette: spruce within the band, clay for the early warning, brick beyond the band. */
export const WATCH_BADGES: Record<WatchStatus, { label: string; tone: 'spruce' | 'clay' | 'brick' | 'neutral'; color: string }> = {
  within: { label: 'Within band', tone: 'spruce', color: '#357b61' },
  early_warning: { label: 'Early warning', tone: 'clay', color: '#cf8347' },
  over: { label: 'Over band', tone: 'brick', color: '#b9473a' },
  under: { label: 'Under band', tone: 'brick', color: '#b9473a' },
  no_band: { label: 'No band', tone: 'neutral', color: '#a29b8e' },
};

export function WatchStatusBadge({ status }: { status: WatchStatus }) {
  const badge = WATCH_BADGES[status];
  return <Badge tone={badge.tone}>{badge.label}</Badge>;
}
