export const payAppKeys = {
  all: ['pay-apps'] as const,
  lists: () => [...payAppKeys.all, 'list'] as const,
  list: (projectId: string) => [...payAppKeys.lists(), projectId] as const,
  details: () => [...payAppKeys.all, 'detail'] as const,
  detail: (payAppId: string) => [...payAppKeys.details(), payAppId] as const,
};
