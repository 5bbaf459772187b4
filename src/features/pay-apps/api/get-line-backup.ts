import { useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { LineTicketView } from '@/shared/schemas/pay-app';
import type { TallySummaryView } from '@/shared/schemas/tally';
import { payAppKeys } from './keys';

export type LineBackup = {
  line: { id: string; bidItemId: string; payAppId: string; payAppNumber: number };
  tallies: TallySummaryView[];
  /** A truck-measure or weight line's tickets (paid, then held); empty for other lines. */
  tickets: LineTicketView[];
};

/** The tallies behind one line (GET /api/pay-apps/:payAppId/lines/:lineId/tallies), fetched when it is opened. */
export function useLineBackup(payAppId: string, lineId: string, enabled: boolean) {
  return useQuery({
    queryKey: [...payAppKeys.detail(payAppId), 'backup', lineId],
    queryFn: () =>
      api.get<LineBackup>(`/api/pay-apps/${encodeURIComponent(payAppId)}/lines/${encodeURIComponent(lineId)}/tallies`),
    enabled,
  });
}
