export const inboxKeys = {
  all: ['inbox'] as const,
  mine: () => [...inboxKeys.all, 'mine'] as const,
};
