import { lineAmountCents, type Cents } from './money';
import { roundTo } from './rounding';

export type PayAppFlagKind = 'beyond_band' | 'no_evidence';

/** One line that should be looked at before money moves; `key` is what a certifier acknowledges. */
export interface PayAppFlag {
  key: string;
  kind: PayAppFlagKind;
  lineId: string;
  itemNumber: string;
  message: string;
  /** beyond_band: quantity to date over contract quantity, basis points (14700 = 147 %). */
  percentOfContractBps: number | null;
  /** beyond_band: quantity to date past the band, in the pay unit, and that quantity priced at the line's price. */
  quantityBeyondBand: number | null;
  amountBeyondBandCents: Cents | null;
}

export interface FlagLine {
  id: string;
  itemNumber: string;
  payUnit: string;
  unitPriceCents: Cents;
  contractQuantity: number;
  thisPeriodQuantity: number;
  toDateQuantity: number;
}

/**
 * Flags of a pay application: lines whose quantity to date passes the over-run band (contract quantity x
 * (1 + band)), with how far past it and what that quantity costs at the line's price; and lines billing a
 * quantity this period with no tally, or with a tally that has no evidence file. Pure.
 */
export function payAppFlags(
  lines: readonly FlagLine[],
  bandOverBps: number,
  evidence: ReadonlyMap<string, { tallies: number; withoutEvidence: number }>,
): PayAppFlag[] {
  const flags: PayAppFlag[] = [];
  for (const l of lines) {
    const limit = (l.contractQuantity * (10_000 + bandOverBps)) / 10_000;
    if (l.contractQuantity > 0 && l.toDateQuantity > limit + 1e-9) {
      const beyond = roundTo(l.toDateQuantity - limit, 4);
      const pct = Math.round((l.toDateQuantity / l.contractQuantity) * 10_000);
      const amount = lineAmountCents(beyond, l.unitPriceCents);
      flags.push({
        key: `beyond_band:${l.id}`,
        kind: 'beyond_band',
        lineId: l.id,
        itemNumber: l.itemNumber,
        message: `Item ${l.itemNumber}: ${l.toDateQuantity} ${l.payUnit} to date is ${pct / 100} % of the contract quantity ${l.contractQuantity} ${l.payUnit}; ${beyond} ${l.payUnit} past the +${bandOverBps / 100} % band ($${(amount / 100).toFixed(2)} at the unit price).`,
        percentOfContractBps: pct,
        quantityBeyondBand: beyond,
        amountBeyondBandCents: amount,
      });
    }
    const e = evidence.get(l.id) ?? { tallies: 0, withoutEvidence: 0 };
    if (l.thisPeriodQuantity > 0 && (e.tallies === 0 || e.withoutEvidence > 0)) {
      flags.push({
        key: `no_evidence:${l.id}`,
        kind: 'no_evidence',
        lineId: l.id,
        itemNumber: l.itemNumber,
        message:
          e.tallies === 0
            ? `Item ${l.itemNumber}: ${l.thisPeriodQuantity} ${l.payUnit} billed this period with no tally behind it.`
            : `Item ${l.itemNumber}: ${e.withoutEvidence} of ${e.tallies} tallies billed this period have no evidence file.`,
        percentOfContractBps: null,
        quantityBeyondBand: null,
        amountBeyondBandCents: null,
      });
    }
  }
  return flags;
}
