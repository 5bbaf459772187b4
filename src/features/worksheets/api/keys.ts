/** Keys of what the worksheets read; tallies share the `tallies` prefix so a save refreshes every tally list. */
export const worksheetKeys = {
  tallies: ['tallies'] as const,
  tally: (tallyId: string) => [...worksheetKeys.tallies, 'detail', tallyId] as const,
};
