export const auditKeys = {
  all: ['audit'] as const,
  project: (projectId: string, page: number, objectType: string) => [...auditKeys.all, 'project', projectId, page, objectType] as const,
  payApp: (payAppId: string) => [...auditKeys.all, 'pay-app', payAppId] as const,
};
