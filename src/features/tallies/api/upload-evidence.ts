import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { toApiError } from '@/lib/api-client';
import type { EvidenceView } from '@/shared/schemas/tally';
import { tallyKeys } from './keys';

/** Uploads files in the multipart field `files` with XMLHttpRequest, the only browser API with upload progress. */
export function uploadEvidence(
  tallyId: string,
  files: File[],
  onProgress: (fraction: number) => void,
): Promise<EvidenceView[]> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/tallies/${encodeURIComponent(tallyId)}/evidence`);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total);
    };
    xhr.onload = () => {
      let body: unknown;
      try {
        body = JSON.parse(xhr.responseText) as unknown;
      } catch {
        body = undefined;
      }
      if (xhr.status >= 200 && xhr.status < 300) resolve((body as { evidence: EvidenceView[] }).evidence);
      else reject(toApiError(xhr.status, body));
    };
    xhr.onerror = () => reject(toApiError(0, undefined));
    const form = new FormData();
    for (const file of files) form.append('files', file, file.name);
    xhr.send(form);
  });
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
