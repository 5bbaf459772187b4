import { addDecimals } from '../../../src/shared/domain/rounding';
import type { ApiErrorDetail } from '../../../src/shared/schemas/api-error';
import type { ChangeOrderItemInput, ContractQuantityView } from '../../../src/shared/schemas/change-order';
import { AppError, validationFailed } from '../../lib/app-error';
import type { BidItemRow } from '../bid-items/bid-items.presenter';

type Checked = Pick<ChangeOrderItemInput, 'kind'> & {
  bidItemId?: string | null;
  quantityDelta?: number | null;
  newItem?: { itemNumber: string } | null;
};

/**
 * Checks a change order's items against the bid schedule as it stands: each changed item is on the project, no
 * contract quantity goes below zero (changes to one item add up), added item numbers are free and unique.
 */
export function checkChangeOrderItems(
  items: readonly Checked[],
  bidItems: Map<string, BidItemRow>,
  quantities: Map<string, ContractQuantityView>,
): void {
  const problems: ApiErrorDetail[] = [];
  const taken: ApiErrorDetail[] = [];
  const running = new Map<string, number>();
  const numbers = new Set([...bidItems.values()].map((b) => b.itemNumber));
  items.forEach((item, i) => {
    if (item.kind === 'add_item') {
      const number = item.newItem?.itemNumber ?? '';
      if (numbers.has(number)) {
        taken.push({
          path: `items.${i}.newItem.itemNumber`,
          message: `Item number ${number} is already on this bid schedule.`,
        });
      }
      numbers.add(number);
      return;
    }
    const bidItem = item.bidItemId ? bidItems.get(item.bidItemId) : undefined;
    if (!bidItem) {
      problems.push({ path: `items.${i}.bidItemId`, message: 'This bid item is not on this project.' });
      return;
    }
    if (item.kind !== 'change_quantity' || item.quantityDelta == null) return;
    const before = running.get(bidItem.id) ?? quantities.get(bidItem.id)?.currentContractQuantity ?? 0;
    const after = addDecimals(before, item.quantityDelta);
    running.set(bidItem.id, after);
    if (after < 0) {
      problems.push({
        path: `items.${i}.quantityDelta`,
        message: `Item ${bidItem.itemNumber} would drop to ${after} ${bidItem.payUnit}; a contract quantity cannot go below zero (now ${before}).`,
      });
    }
  });
  if (problems.length > 0) throw validationFailed(problems);
  if (taken.length > 0) throw new AppError(409, 'ITEM_NUMBER_TAKEN', 'An item number is already in use.', taken);
}
