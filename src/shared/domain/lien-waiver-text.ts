import type { LienWaiverKind } from '../constants';

/** Our own names for the four forms; the statute's own titles govern where a state prescribes them. */
export const LIEN_WAIVER_TITLES: Record<LienWaiverKind, string> = {
  conditional_progress: 'Conditional waiver on progress payment',
  unconditional_progress: 'Unconditional waiver on progress payment',
  conditional_final: 'Conditional waiver on final payment',
  unconditional_final: 'Unconditional waiver on final payment',
};

/** When each form fits, in plain words. */
export const LIEN_WAIVER_SUMMARIES: Record<LienWaiverKind, string> = {
  conditional_progress: 'Takes effect only when the payment for this application is actually received.',
  unconditional_progress: 'Takes effect at once: issue it only after the payment has settled.',
  conditional_final: 'For the final application; takes effect only when the final payment is received.',
  unconditional_final: 'For the final application; takes effect at once, after the final payment has settled.',
};

/** The state codes that prescribe the wording of lien waivers, where Tallyard knows of one (from memory). */
const STATUTES: Record<string, string> = {
  CA: 'California Civil Code sections 8132 to 8138 prescribe',
  TX: 'Texas Property Code section 53.284 prescribes',
};

/**
 * The notice on every waiver screen and PDF: where the project's state prescribes a form, its wording governs;
 * Tallyard's template is not that form and is not legal advice.
 */
export function statutoryNotice(state: string): string {
  const statute = STATUTES[state.trim().toUpperCase()];
  const where = statute
    ? `This project is in ${state.trim().toUpperCase()}, where ${statute} the waiver forms: a waiver must follow that statutory wording.`
    : 'Where the project’s state prescribes a statutory waiver form (for example California Civil Code sections 8132 to 8138, or Texas Property Code section 53.284), the waiver must follow that wording.';
  return `${where} Tallyard’s waivers use its own template; waiver and payment rights follow the contract and the governing statute. This is not legal advice: ask your counsel before relying on a waiver.`;
}

/** The operative sentence of each form. */
export function waiverBody(
  kind: LienWaiverKind,
  p: { claimant: string; customer: string; owner: string; project: string; amount: string; throughDate: string },
): string {
  const base = `${p.claimant} (claimant) furnished labor, services, equipment or material for ${p.project}, owned by ${p.owner}, under its contract with ${p.customer}.`;
  switch (kind) {
    case 'conditional_progress':
      return `${base} On receipt by the claimant of a payment of ${p.amount}, and when that payment has cleared the bank, this document waives and releases any lien, stop payment notice and payment bond right the claimant has for work through ${p.throughDate}. It takes effect only on that payment.`;
    case 'unconditional_progress':
      return `${base} The claimant has received a progress payment of ${p.amount} and waives and releases any lien, stop payment notice and payment bond right it has for work through ${p.throughDate}. This waiver is unconditional and takes effect now.`;
    case 'conditional_final':
      return `${base} On receipt by the claimant of a final payment of ${p.amount}, and when that payment has cleared the bank, this document waives and releases any lien, stop payment notice and payment bond right the claimant has for all work on the project. It takes effect only on that payment.`;
    case 'unconditional_final':
      return `${base} The claimant has been paid in full (${p.amount} in final payment) and waives and releases any lien, stop payment notice and payment bond right it has for all work on the project. This waiver is unconditional and takes effect now.`;
  }
}

/**
 * The sentence that keeps the exceptions out of the release. With none, it says so; the statutory form's own
 * exceptions wording governs where the state prescribes one.
 */
export function exceptionsSentence(count: number, total: string): string {
  if (count === 0)
    return 'Exceptions: none listed. Where the governing statute prescribes the exceptions wording, that wording governs.';
  return `Exceptions: this document does not waive or release the ${count === 1 ? 'amount' : `${count} amounts`} listed below (${total} in all), nor rights the contract or the governing statute keep for them.`;
}
