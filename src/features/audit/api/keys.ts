export const auditKeys = {
  all: ['audit'] as const,
  project: (projectId: string, page: number, filter: object) =>
    [...auditKeys.all, 'project', projectId, page, filter] as const,
  payApp: (payAppId: string) => [...auditKeys.all, 'pay-app', payAppId] as const,
};
