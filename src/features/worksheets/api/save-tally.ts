import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api, toApiError } from '@/lib/api-client';
import type { createTallySchema, EvidenceView, TallyView, updateTallySchema } from '@/shared/schemas/tally';
import { worksheetKeys } from './keys';

export type CreateTallyBody = z.input<typeof createTallySchema>;
export type UpdateTallyBody = z.input<typeof updateTallySchema>;

export type SaveWorksheetTally = { tallyId: string | null; body: CreateTallyBody; files: readonly File[] };

/**
 * Saves the worksheet as a tally in one request: POST a new one, or PATCH the draft it was opened from (the server
 * keeps the earlier inputs as a revision). With files, the body is a multipart form: the tally as JSON in the field
 * `tally` and the worksheet's files beside it, saved in one transaction (a refused file saves nothing). The server
 * recomputes the quantity and hashes each file (SHA-256); its figures are the ones billed.
 */
export async function saveWorksheetTally(
  projectId: string,
  { tallyId, body, files }: SaveWorksheetTally,
): Promise<{ tally: TallyView; evidence: EvidenceView[] }> {
  const url = tallyId
    ? `/api/tallies/${encodeURIComponent(tallyId)}`
    : `/api/projects/${encodeURIComponent(projectId)}/tallies`;
  if (files.length === 0) {
    const { tally } = tallyId
      ? await api.patch<{ tally: TallyView }>(url, body)
      : await api.post<{ tally: TallyView }>(url, body);
    return { tally, evidence: [] };
  }
  const form = new FormData();
  form.append('tally', JSON.stringify(body));
  for (const file of files) form.append('files', file, file.name);
  const res = await fetch(url, {
    method: tallyId ? 'PATCH' : 'POST',
    body: form,
    credentials: 'same-origin',
    headers: { Accept: 'application/json' },
  });
  const answer = (await res.json().catch(() => undefined)) as
    { tally: TallyView; evidence: EvidenceView[] } | undefined;
  if (!res.ok || !answer) throw toApiError(res.status, answer);
  return answer;
}

export function useSaveWorksheetTally(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SaveWorksheetTally) => saveWorksheetTally(projectId, input),
    onSettled: () => queryClient.invalidateQueries({ queryKey: worksheetKeys.tallies }),
  });
}
