import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '@/lib/api-client';
import type { createTallySchema, TallyView } from '@/shared/schemas/tally';
import { worksheetKeys } from './keys';

export type CreateTallyBody = z.input<typeof createTallySchema>;

/** POST /api/projects/:projectId/tallies; the server recomputes the worksheet and keeps its own result. */
export async function createTally(projectId: string, body: CreateTallyBody): Promise<TallyView> {
  const { tally } = await api.post<{ tally: TallyView }>(`/api/projects/${encodeURIComponent(projectId)}/tallies`, body);
  return tally;
}

export function useCreateTally(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateTallyBody) => createTally(projectId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: worksheetKeys.tallies }),
  });
}
