export const companyKeys = {
  all: ['companies'] as const,
  list: () => [...companyKeys.all, 'list'] as const,
  page: (companyId: string) => [...companyKeys.all, 'page', companyId] as const,
};
