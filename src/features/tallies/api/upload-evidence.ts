import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { uploadFiles } from '@/lib/upload-files';
import type { EvidenceView } from '@/shared/schemas/tally';
import { tallyKeys } from './keys';

/** Uploads a tally's evidence files with progress (see uploadFiles). */
export async function uploadEvidence(
  tallyId: string,
  files: File[],
  onProgress: (fraction: number) => void,
): Promise<EvidenceView[]> {
  const url = `/api/tallies/${encodeURIComponent(tallyId)}/evidence`;
  return (await uploadFiles<{ evidence: EvidenceView[] }>(url, files, onProgress)).evidence;
}

export function useUploadEvidence(tallyId: string) {
  const client = useQueryClient();
  const [progress, setProgress] = useState(0);
  const mutation = useMutation({
    mutationFn: (files: File[]) => {
      setProgress(0);
      return uploadEvidence(tallyId, files, setProgress);
    },
    onSuccess: () => client.invalidateQueries({ queryKey: tallyKeys.all }),
  });
  return { ...mutation, progress };
}
