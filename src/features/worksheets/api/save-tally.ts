import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { api, toApiError } from '@/lib/api-client';
import type { createTallySchema, EvidenceView, TallyView, updateTallySchema } from '@/shared/schemas/tally';
import { worksheetKeys } from './keys';

export type CreateTallyBody = z.input<typeof createTallySchema>;
export type UpdateTallyBody = z.input<typeof updateTallySchema>;

/** The files loaded into the worksheet, stored as the tally's evidence (the server hashes each with SHA-256). */
async function attachFiles(tallyId: string, files: readonly File[]): Promise<EvidenceView[]> {
  if (files.length === 0) return [];
  const form = new FormData();
  for (const file of files) form.append('files', file, file.name);
  const res = await fetch(`/api/tallies/${encodeURIComponent(tallyId)}/evidence`, {
    method: 'POST',
    body: form,
    credentials: 'same-origin',
    headers: { Accept: 'application/json' },
  });
  const body = (await res.json().catch(() => undefined)) as { evidence: EvidenceView[] } | undefined;
  if (!res.ok) throw toApiError(res.status, body);
  return body?.evidence ?? [];
}

export type SaveWorksheetTally = { tallyId: string | null; body: CreateTallyBody; files: readonly File[] };

/**
 * Saves the worksheet as a tally: POST a new one, or PATCH the draft it was opened from (the server keeps the
 * earlier inputs as a revision); then the worksheet's files go up as its evidence. The server recomputes the
 * quantity; its figure is the one billed.
 */
export async function saveWorksheetTally(
  projectId: string,
  { tallyId, body, files }: SaveWorksheetTally,
): Promise<{ tally: TallyView; evidence: EvidenceView[] }> {
  const { tally } = tallyId
    ? await api.patch<{ tally: TallyView }>(`/api/tallies/${encodeURIComponent(tallyId)}`, body)
    : await api.post<{ tally: TallyView }>(`/api/projects/${encodeURIComponent(projectId)}/tallies`, body);
  const evidence = await attachFiles(tally.id, files);
  return { tally, evidence };
}

export function useSaveWorksheetTally(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SaveWorksheetTally) => saveWorksheetTally(projectId, input),
    onSettled: () => queryClient.invalidateQueries({ queryKey: worksheetKeys.tallies }),
  });
}
