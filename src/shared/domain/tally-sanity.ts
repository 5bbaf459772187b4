import { fmt } from './earthwork/trail';

/** Past these a tally needs a written reason: more than twice the remaining, or ten times the contract quantity. */
export const SANITY_REMAINING_FACTOR = 2;
export const SANITY_CONTRACT_FACTOR = 10;

export interface SanityInput {
  /** The tally's quantity, in the item's pay unit. */
  quantity: number;
  /** The item's current contract quantity. */
  contractQuantity: number;
  /** Quantity of the item's other tallies (this one left out). */
  talliedElsewhere: number;
  payUnit: string;
}

/**
 * Why a tally's quantity looks wrong for its item (none: an empty list). Remaining = contract - tallied elsewhere,
 * at least 0. Common practice (a typo or a wrong unit shows as an order of magnitude): the limits are ours.
 */
export function sanityConcerns({ quantity, contractQuantity, talliedElsewhere, payUnit }: SanityInput): string[] {
  const concerns: string[] = [];
  const remaining = Math.max(0, contractQuantity - talliedElsewhere);
  if (contractQuantity > 0 && quantity > SANITY_CONTRACT_FACTOR * contractQuantity) {
    concerns.push(
      `${fmt(quantity, 2)} ${payUnit} is more than ${SANITY_CONTRACT_FACTOR} times the contract quantity (${fmt(contractQuantity, 2)} ${payUnit})`,
    );
  } else if (quantity > SANITY_REMAINING_FACTOR * remaining) {
    concerns.push(
      `${fmt(quantity, 2)} ${payUnit} is more than twice the quantity left on the item (${fmt(remaining, 2)} ${payUnit} of ${fmt(contractQuantity, 2)} not yet tallied)`,
    );
  }
  return concerns;
}
