import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { toApiError } from '@/lib/api-client';
import type { BidItemView } from '@/shared/schemas/bid-item';

export type ImportResult = { imported: number; bidItems: BidItemView[] };

/**
 * Uploads a bid schedule CSV as multipart field `file`. XMLHttpRequest rather than fetch, because only
 * XHR reports upload progress. Rejects with an ApiError (its details carry line and column per bad cell).
 */
export function importBidItems(
  projectId: string,
  file: File,
  onProgress: (fraction: number) => void,
): Promise<ImportResult> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/projects/${encodeURIComponent(projectId)}/bid-items/import`);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.responseType = 'text';
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total);
    };
    xhr.onload = () => {
      const body = parseJson(xhr.responseText);
      if (xhr.status >= 200 && xhr.status < 300) resolve(body as ImportResult);
      else reject(toApiError(xhr.status, body));
    };
    xhr.onerror = () => reject(toApiError(0, undefined));
    const form = new FormData();
    form.append('file', file, file.name);
    xhr.send(form);
  });
}

function parseJson(text: string): unknown {
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return undefined;
  }
}

/** The import mutation plus its upload progress (0 to 1), reset at each new upload. */
export function useImportBidItems(projectId: string) {
  const [progress, setProgress] = useState(0);
  const mutation = useMutation({
    mutationFn: (file: File) => {
      setProgress(0);
      return importBidItems(projectId, file, setProgress);
    },
  });
  return { ...mutation, progress };
}
