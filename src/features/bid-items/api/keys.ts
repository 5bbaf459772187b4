export const bidItemKeys = {
  all: ['bid-items'] as const,
  lists: () => [...bidItemKeys.all, 'list'] as const,
  list: (projectId: string) => [...bidItemKeys.lists(), projectId] as const,
};
