import type { TallyListFilter } from '@/shared/schemas/tally';

export const tallyKeys = {
  all: ['tallies'] as const,
  lists: () => [...tallyKeys.all, 'list'] as const,
  list: (projectId: string, query: TallyListFilter = {}) => [...tallyKeys.lists(), projectId, query] as const,
  details: () => [...tallyKeys.all, 'detail'] as const,
  detail: (tallyId: string) => [...tallyKeys.details(), tallyId] as const,
};
