import { PAY_UNITS, type PayLineSource, type PayUnit } from '../constants';
import { formatCount, formatMoney, formatNumber, formatPercent, formatQuantity } from '../format';
import { lineAmountCents, type Cents } from './money';
import { roundTo } from './rounding';

/** A quantity in its pay unit with the one display precision ("8,600.00 SY"); an unknown unit keeps 4 decimals. */
const qty = (q: number, unit: string) =>
  (PAY_UNITS as readonly string[]).includes(unit)
    ? formatQuantity(q, unit as PayUnit)
    : `${formatNumber(q, 4)} ${unit}`;

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
  /** What the quantity was taken from (`paySourceOf`); steps, settings and days lines have no tally to look for. */
  paidFrom: PayLineSource;
}

/**
 * Flags of a pay application: lines whose quantity to date passes the over-run band (contract quantity x
 * (1 + band)), with how far past it and what that quantity costs at the line's price; and lines billing a
 * quantity this period from tallies or tickets with none behind it, or with a tally that has no evidence file. A
 * line paid by mobilization steps or by the item's percent complete or stages is backed by those settings and
 * their audit events, and force account by its daily sheets signed by both sides, not by tallies, so it raises no
 * evidence flag. Pure.
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
        message: `Item ${l.itemNumber}: ${qty(l.toDateQuantity, l.payUnit)} to date is ${formatPercent(pct / 100)} of the contract quantity ${qty(l.contractQuantity, l.payUnit)}; ${qty(beyond, l.payUnit)} past the +${formatPercent(bandOverBps / 100)} band (${formatMoney(amount)} at the unit price).`,
        percentOfContractBps: pct,
        quantityBeyondBand: beyond,
        amountBeyondBandCents: amount,
      });
    }
    const e = evidence.get(l.id) ?? { tallies: 0, withoutEvidence: 0 };
    const measured = l.paidFrom === 'tallies' || l.paidFrom === 'tickets';
    if (measured && l.thisPeriodQuantity > 0 && (e.tallies === 0 || e.withoutEvidence > 0)) {
      flags.push({
        key: `no_evidence:${l.id}`,
        kind: 'no_evidence',
        lineId: l.id,
        itemNumber: l.itemNumber,
        message:
          e.tallies === 0
            ? `Item ${l.itemNumber}: ${qty(l.thisPeriodQuantity, l.payUnit)} billed this period with no ${l.paidFrom === 'tickets' ? 'ticket' : 'tally'} behind it.`
            : e.tallies === 1
              ? `Item ${l.itemNumber}: the tally billed this period has no evidence file.`
              : `Item ${l.itemNumber}: ${e.withoutEvidence} of the ${formatCount(e.tallies, 'tally', 'tallies')} billed this period ${e.withoutEvidence === 1 ? 'has' : 'have'} no evidence file.`,
        percentOfContractBps: null,
        quantityBeyondBand: null,
        amountBeyondBandCents: null,
      });
    }
  }
  return flags;
}
