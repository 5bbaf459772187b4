/** The general contractor's unsaved verdicts on lines, keyed by line id. */
export type LineDecision = { decision: 'approve' | 'dispute'; reason: string; counter: string };
export type ReviewDraft = Record<string, LineDecision>;

/** The review request body from the draft, and the problems that keep it from being sent (per line). */
export function reviewBody(
  draft: ReviewDraft,
  itemNumberOf: (lineId: string) => string,
  claimedOf: (lineId: string) => number = () => Infinity,
) {
  const problems: string[] = [];
  const lines = Object.entries(draft).map(([lineId, d]) => {
    if (d.decision === 'approve') return { lineId, decision: 'approve' as const };
    const counter = Number(d.counter);
    if (d.reason.trim().length < 3) problems.push(`Item ${itemNumberOf(lineId)}: give a reason for the dispute`);
    if (d.counter.trim() === '' || !Number.isFinite(counter) || counter < 0)
      problems.push(`Item ${itemNumberOf(lineId)}: give a counter quantity of 0 or more`);
    else if (counter > claimedOf(lineId))
      problems.push(
        `Item ${itemNumberOf(lineId)}: the counter quantity cannot be above the ${claimedOf(lineId)} claimed; say in the reason if more was done`,
      );
    return { lineId, decision: 'dispute' as const, reason: d.reason.trim(), counterQuantity: counter };
  });
  return { lines, problems };
}

/**
 * Approves every line that has no verdict yet: lines already approved, and lines the reviewer has already decided
 * (a dispute being written, say), are left as they are.
 */
export function approveRemaining(draft: ReviewDraft, lines: { id: string; reviewStatus: string }[]): ReviewDraft {
  const next = { ...draft };
  for (const line of lines) {
    if (line.reviewStatus !== 'approved' && !(line.id in next))
      next[line.id] = { decision: 'approve', reason: '', counter: '' };
  }
  return next;
}
