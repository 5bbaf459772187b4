import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { TallyView } from '@/shared/schemas/tally';
import { worksheetKeys } from './keys';

export function getTally(tallyId: string): Promise<{ tally: TallyView }> {
  return api.get<{ tally: TallyView }>(`/api/tallies/${encodeURIComponent(tallyId)}`);
}

export const tallyQueryOptions = (tallyId: string) =>
  queryOptions({ queryKey: worksheetKeys.tally(tallyId), queryFn: () => getTally(tallyId) });

/** A saved tally, to prefill its worksheet (`?tally=<id>`); idle without an id. */
export function useTally(tallyId: string | null) {
  return useQuery({ ...tallyQueryOptions(tallyId ?? ''), enabled: Boolean(tallyId) });
}
