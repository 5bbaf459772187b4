import { useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { TallySummaryView } from '@/shared/schemas/tally';
import { payAppKeys } from './keys';

export type LineBackup = {
  line: { id: string; bidItemId: string; payAppId: string; payAppNumber: number };
  tallies: TallySummaryView[];
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
