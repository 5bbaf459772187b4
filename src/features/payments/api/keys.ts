export const paymentKeys = {
  all: ['payments'] as const,
  project: (projectId: string) => [...paymentKeys.all, 'project', projectId] as const,
};
