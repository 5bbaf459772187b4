import type { VariationPreset } from '../../../src/shared/constants';
import { lineAmountCents } from '../../../src/shared/domain/money';
import { addDecimals, roundTo } from '../../../src/shared/domain/rounding';
import { bandForItem, isEarlyWarning, quantityVariance, type VarianceBand } from '../../../src/shared/domain/variance';
import type { ContractQuantityView } from '../../../src/shared/schemas/change-order';
import type { VarianceRowView, WatchStatus } from '../../../src/shared/schemas/variance';
import type { BidItemRow } from '../bid-items/bid-items.presenter';

export type WatchClause = { preset: VariationPreset; custom: VarianceBand };

export type WatchInputs = {
  item: BidItemRow;
  quantity: ContractQuantityView;
  /** Major by the contract's flag or by the threshold share of the original contract amount. */
  isMajor: boolean;
  approvedToDate: number;
  pending: number;
  forecast: VarianceRowView['forecast'];
  openChangeOrder: VarianceRowView['openChangeOrder'];
};

/** One line of the quantity watch: the item's quantities, its forecast at completion and its band status. */
export function watchRow(clause: WatchClause, inputs: WatchInputs): VarianceRowView {
  const { item, quantity, approvedToDate, pending, forecast } = inputs;
  const contract = quantity.currentContractQuantity;
  const forecastAtCompletion = forecast?.quantity ?? addDecimals(approvedToDate, pending);
  const band = bandForItem(clause.preset, clause.custom, inputs.isMajor);
  let status: WatchStatus = 'no_band';
  let result: ReturnType<typeof quantityVariance> | null = null;
  let projected = true;
  if (band && contract > 0) {
    result = quantityVariance({
      contractQuantity: contract,
      forecastQuantity: forecastAtCompletion,
      unitPriceCents: item.unitPriceCents,
      band,
      preset: clause.preset,
    });
    status =
      result.status === 'within' && isEarlyWarning(contract, forecastAtCompletion, band)
        ? 'early_warning'
        : result.status;
    // Without a forecast the quantity to date stands in for it: it can already run over, but an item still
    // being worked is not short of its band, so the under side waits for a forecast.
    if (!forecast && forecastAtCompletion < contract) {
      status = 'within';
      projected = false;
      result = { ...result, quantityBeyondBand: 0 };
    }
  }
  const beyond = result ? roundTo(result.quantityBeyondBand, 4) : 0;
  return {
    bidItemId: item.id,
    itemNumber: item.itemNumber,
    description: item.description,
    payUnit: item.payUnit,
    unitPriceCents: item.unitPriceCents,
    isMajor: inputs.isMajor,
    originalQuantity: quantity.originalQuantity,
    currentContractQuantity: contract,
    approvedToDate,
    pending,
    forecast,
    forecastAtCompletion,
    variancePercent:
      contract > 0 && projected ? roundTo(((forecastAtCompletion - contract) / contract) * 100, 2) : null,
    band:
      band && result ? { ...band, lower: roundTo(result.band.lower, 4), upper: roundTo(result.band.upper, 4) } : null,
    status,
    quantityBeyondBand: beyond,
    amountBeyondBandCents: result ? lineAmountCents(beyond, item.unitPriceCents) : 0,
    draftChangeOrderPath:
      status === 'over' || status === 'under' ? `/api/bid-items/${item.id}/variance-change-order` : null,
    openChangeOrder: inputs.openChangeOrder,
  };
}
