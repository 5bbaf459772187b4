import type { DisputeResolution, PayUnit, WaiverExceptionKind } from '../constants';
import { formatMoney, formatQuantity } from '../format';
import { currentContract, type ContractChangeInput, type ContractItemInput } from './contract';
import { addExact } from './decimal';
import { lineAmountCents, subtractCents, type Cents } from './money';

export type WaiverException = { kind: WaiverExceptionKind; description: string; amountCents: Cents };

/** A line of the application that was disputed: what was claimed this period and what was certified. */
export type DisputedLineInput = {
  itemNumber: string;
  description: string;
  payUnit: PayUnit;
  unitPriceCents: Cents;
  /** The this-period quantity claimed when the first dispute on the line was opened. */
  claimedQuantity: number;
  /** The this-period quantity as certified. */
  certifiedQuantity: number;
};

/** A dispute raised on a line, as kept: the claim when it was opened and how the subcontractor answered it. */
export type LineDisputeInput = Omit<DisputedLineInput, 'claimedQuantity'> & {
  lineId: string;
  claimedQuantity: number | null;
  resolution: DisputeResolution | null;
};

/**
 * The claim a waiver reserves for each disputed line: the subcontractor's last own figure (common practice: a
 * waiver keeps open what the claimant still claims, and nothing it gave up itself). Disputes come oldest first;
 * the latest one on a line speaks. Where the subcontractor answered it by proposing a quantity of its own, that
 * figure is its claim now, and once certified nothing of the line is in dispute. Where it took the counter
 * quantity to be paid now, the claim it had when the dispute opened is kept open. A dispute opened before claims
 * were kept (no claimed quantity) reserves nothing.
 */
export function disputedClaims(disputes: readonly LineDisputeInput[]): DisputedLineInput[] {
  const latest = new Map<string, LineDisputeInput>();
  for (const d of disputes) latest.set(d.lineId, d);
  return [...latest.values()].flatMap(({ lineId: _lineId, resolution, claimedQuantity, ...line }) => {
    if (claimedQuantity === null || resolution === 'quantity_proposed') return [];
    return [{ ...line, claimedQuantity }];
  });
}

export type WaiverExceptionsInput = {
  /** The application's retainage to date (held, not yet released), cents. */
  retainageHeldCents: Cents;
  disputedLines: readonly DisputedLineInput[];
  /** Approved change orders not yet in any pay application, with their value (see changeOrderValues). */
  unpaidChangeOrders: readonly { number: number; title: string; amountCents: Cents }[];
  /** Exceptions the signer adds, in the signer's words. */
  signerAdded: readonly { description: string; amountCents: Cents }[];
};

/**
 * What a waiver does not release, each with its amount (common practice; statutory forms such as California
 * Civil Code section 8134 leave room for "exceptions" and disputed claims): retainage still held, the part of
 * each disputed line's claim that was not certified (quantity claimed - certified, priced at the line's unit
 * price, rounded once), approved change orders not yet billed, and what the signer adds. Zero amounts are left
 * out. Pure; the order is that of the kinds above.
 */
export function waiverExceptions(input: WaiverExceptionsInput): WaiverException[] {
  const out: WaiverException[] = [];
  if (input.retainageHeldCents > 0)
    out.push({
      kind: 'retainage_held',
      description: `Retainage held on this and earlier work, not yet paid: ${formatMoney(input.retainageHeldCents)}.`,
      amountCents: input.retainageHeldCents,
    });
  for (const line of input.disputedLines) {
    const open = addExact(line.claimedQuantity, -line.certifiedQuantity);
    if (open <= 0) continue;
    const amountCents = lineAmountCents(open, line.unitPriceCents);
    if (amountCents <= 0) continue;
    out.push({
      kind: 'disputed',
      description: `Item ${line.itemNumber} ${line.description}: ${formatQuantity(line.claimedQuantity, line.payUnit)} claimed, ${formatQuantity(line.certifiedQuantity, line.payUnit)} certified; ${formatQuantity(open, line.payUnit)} in dispute.`,
      amountCents,
    });
  }
  for (const co of input.unpaidChangeOrders) {
    if (co.amountCents <= 0) continue;
    out.push({
      kind: 'change_order_unpaid',
      description: `Change order ${co.number} (${co.title}), approved and not yet paid.`,
      amountCents: co.amountCents,
    });
  }
  for (const added of input.signerAdded)
    out.push({ kind: 'signer_added', description: added.description, amountCents: added.amountCents });
  return out;
}

/**
 * Each approved change order's value: the contract sum after it less the sum before it, in approval order
 * (currentContract, the one contract computation). A price change is valued on the item's current quantity.
 */
export function changeOrderValues(
  items: readonly ContractItemInput[],
  approvedChanges: readonly ContractChangeInput[],
): Map<number, Cents> {
  const values = new Map<number, Cents>();
  let before = currentContract(items, []).contractSumCents;
  const numbers = [...new Set(approvedChanges.map((c) => c.changeOrderNumber))];
  for (const [i, n] of numbers.entries()) {
    const through = new Set(numbers.slice(0, i + 1));
    const after = currentContract(
      items,
      approvedChanges.filter((c) => through.has(c.changeOrderNumber)),
    ).contractSumCents;
    values.set(n, subtractCents(after, before));
    before = after;
  }
  return values;
}
