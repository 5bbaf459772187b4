import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/** A company's admin removes one of its people from the job (the person's sessions end). */
export function useRemoveFromJob(projectId: string) {
  return useMutation({
    mutationFn: (userId: string) =>
      api.delete(`/api/projects/${encodeURIComponent(projectId)}/members/${encodeURIComponent(userId)}`),
  });
}

/** A company's admin removes one of its people from the company, with every seat held through it. */
export function useRemoveFromCompany(companyId: string) {
  return useMutation({
    mutationFn: (userId: string) =>
      api.delete(`/api/companies/${encodeURIComponent(companyId)}/members/${encodeURIComponent(userId)}`),
  });
}
