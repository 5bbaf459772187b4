import type { UnitSystem } from '@/shared/constants';
import { billedQuantity, type BilledQuantity, type BillOptions } from '@/shared/domain/billed-quantity';
import { isDomainError } from '@/shared/domain/domain-error';
import type { BidItemView } from '@/shared/schemas/bid-item';
import type { WorksheetMethod } from './types';

export type BillPreview =
  { bill: BilledQuantity; problem: null } | { bill: null; problem: { path: string; message: string } };

export type ProjectFactors = { swellPercent: number; shrinkagePercent: number; units: UnitSystem };

/**
 * What saving would bill: the same pure function the server runs on save (src/shared/domain/billed-quantity.ts),
 * from the worksheet's live inputs and result.
 */
export function previewBill(
  method: WorksheetMethod,
  inputs: Record<string, unknown> | null,
  result: Record<string, unknown> | null,
  item: Pick<BidItemView, 'itemNumber' | 'payUnit' | 'basis'>,
  factors: ProjectFactors,
  options: BillOptions,
): BillPreview {
  try {
    return { bill: billedQuantity(method, inputs, result, item, factors, options), problem: null };
  } catch (error) {
    if (isDomainError(error)) return { bill: null, problem: { path: error.path, message: error.message } };
    throw error;
  }
}
