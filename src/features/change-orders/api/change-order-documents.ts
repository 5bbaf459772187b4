import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { api } from '@/lib/api-client';
import { uploadFiles } from '@/lib/upload-files';
import type { ChangeOrderDocumentView } from '@/shared/schemas/change-order';
import { changeOrderKeys } from './change-orders';

const documentsKey = (id: string) => [...changeOrderKeys.detail(id), 'documents'] as const;

export const useChangeOrderDocuments = (id: string) =>
  useQuery({
    queryKey: documentsKey(id),
    queryFn: async () =>
      (
        await api.get<{ documents: ChangeOrderDocumentView[] }>(
          `/api/change-orders/${encodeURIComponent(id)}/documents`,
        )
      ).documents,
  });

/** Attaches files with progress; the change order (its history) and its documents are read again after. */
export function useAttachChangeOrderDocuments(id: string) {
  const client = useQueryClient();
  const [progress, setProgress] = useState(0);
  const mutation = useMutation({
    mutationFn: async (files: File[]) => {
      setProgress(0);
      const url = `/api/change-orders/${encodeURIComponent(id)}/documents`;
      return (await uploadFiles<{ documents: ChangeOrderDocumentView[] }>(url, files, setProgress)).documents;
    },
    onSuccess: () => client.invalidateQueries({ queryKey: changeOrderKeys.detail(id) }),
  });
  return { ...mutation, progress };
}
