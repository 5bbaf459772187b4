import { toApiError } from '@/lib/api-client';

/**
 * Posts files in the multipart field `files` with XMLHttpRequest (the only browser API with upload progress) and
 * resolves with the JSON body; a refusal rejects with the server's ApiError.
 */
export function uploadFiles<T>(url: string, files: File[], onProgress: (fraction: number) => void): Promise<T> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', url);
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
      if (xhr.status >= 200 && xhr.status < 300) resolve(body as T);
      else reject(toApiError(xhr.status, body));
    };
    xhr.onerror = () => reject(toApiError(0, undefined));
    const form = new FormData();
    for (const file of files) form.append('files', file, file.name);
    xhr.send(form);
  });
}
