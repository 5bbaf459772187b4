import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { CreateTallyInput, TallyView } from '@/shared/schemas/tally';
import { tallyKeys } from './keys';
import { uploadEvidence } from './upload-evidence';

/** Every tally mutation refreshes the tally lists and details (key prefix `tallies`). */
function useTallyMutation<TInput, TResult>(fn: (input: TInput) => Promise<TResult>) {
  const client = useQueryClient();
  return useMutation({ mutationFn: fn, onSuccess: () => client.invalidateQueries({ queryKey: tallyKeys.all }) });
}

export function useMarkReady() {
  return useTallyMutation(
    async (tallyId: string) =>
      (await api.post<{ tally: TallyView }>(`/api/tallies/${encodeURIComponent(tallyId)}/ready`)).tally,
  );
}

export function useDeleteTally() {
  return useTallyMutation((tallyId: string) => api.delete(`/api/tallies/${encodeURIComponent(tallyId)}`));
}

export function useDeleteEvidence() {
  return useTallyMutation((evidenceId: string) => api.delete(`/api/evidence/${encodeURIComponent(evidenceId)}`));
}

/**
 * A direct quantity with its evidence: POST (or PATCH the draft), then the files to the tally's evidence route.
 * The same two steps the worksheets take (see DEVELOPERS.md, decision log: worksheet files and evidence).
 */
export async function saveDirectTally(
  projectId: string,
  { tallyId, body, files }: { tallyId: string | null; body: CreateTallyInput; files: readonly File[] },
): Promise<{ tally: TallyView; filesError: unknown }> {
  const { tally } = tallyId
    ? await api.patch<{ tally: TallyView }>(`/api/tallies/${encodeURIComponent(tallyId)}`, body)
    : await api.post<{ tally: TallyView }>(`/api/projects/${encodeURIComponent(projectId)}/tallies`, body);
  // A refused file leaves the draft saved without it; the caller says so and the tally page takes the file again.
  const filesError =
    files.length > 0
      ? await uploadEvidence(tally.id, [...files], () => undefined).then(
          () => null,
          (err: unknown) => err,
        )
      : null;
  return { tally, filesError };
}
