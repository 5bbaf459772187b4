export const lienWaiverKeys = {
  all: ['lien-waivers'] as const,
  project: (projectId: string) => [...lienWaiverKeys.all, 'project', projectId] as const,
};
