import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { EvidenceView, TallyView } from '@/shared/schemas/tally';
import { worksheetKeys } from './keys';

/** The tally and its evidence files (the worksheet lists them; the inputs hold what was read from them). */
export type WorksheetTally = { tally: TallyView; evidence: EvidenceView[] };

export function getTally(tallyId: string): Promise<WorksheetTally> {
  return api.get<WorksheetTally>(`/api/tallies/${encodeURIComponent(tallyId)}`);
}

export const tallyQueryOptions = (tallyId: string) =>
  queryOptions({ queryKey: worksheetKeys.tally(tallyId), queryFn: () => getTally(tallyId) });

/** A saved tally, to prefill its worksheet (`?tally=<id>`); idle without an id. */
export function useTally(tallyId: string | null) {
  return useQuery({ ...tallyQueryOptions(tallyId ?? ''), enabled: Boolean(tallyId) });
}
