import { currentContract, type ContractChangeInput, type ContractItemInput } from './contract';
import { subtractCents, sumCents, type Cents } from './money';

/** An approved change order with its changes (in the contract's terms, see currentContract). */
export interface ApprovedChangeOrderInput {
  number: number;
  title: string;
  /** When the change order was approved (ISO 8601). */
  approvedAt: string;
  changes: ContractChangeInput[];
}

export interface ChangeOrderSummaryLine {
  number: number;
  title: string;
  approvedAt: string;
  /** What the change order moved the contract sum by, applied after the ones approved before it. */
  amountCents: Cents;
  /** Of which force account paid to date on its signed days (withForceAccount in pay-app-package.ts). */
  forceAccountCents?: Cents;
}

export interface ChangeOrderSummary {
  /** Approved change orders up to the application's cut-off. */
  approvedCount: number;
  /** Their net amount: current contract sum at the cut-off - original contract sum. */
  netChangeCents: Cents;
  /** The net amount of those approved after the previous application's cut-off. */
  sinceLastCents: Cents;
  lines: ChangeOrderSummaryLine[];
}

const time = (iso: string) => Date.parse(iso);

/**
 * The change orders a pay application reports: those approved up to `asOf` (its certification, or null for an
 * application still open: all approved so far), in the order of approval. Each one's amount is the step it gave
 * the contract sum of currentContract, so the lines add up to the net change exactly; "since last" is the part
 * approved after `previousAsOf` (the previous application's cut-off, or null for the first application). Pure.
 */
export function changeOrderSummary(
  items: readonly ContractItemInput[],
  approvedInOrder: readonly ApprovedChangeOrderInput[],
  asOf: string | null,
  previousAsOf: string | null,
): ChangeOrderSummary {
  const included = approvedInOrder.filter((co) => asOf === null || time(co.approvedAt) <= time(asOf));
  const lines: ChangeOrderSummaryLine[] = [];
  const applied: ContractChangeInput[] = [];
  for (const co of included) {
    // The contract sum is the sum of its items' amounts, so its step is the step of the items this change order
    // touches; pricing only those keeps a read of a large contract from pricing every item once per change order.
    const touchedIds = new Set(co.changes.map((c) => c.bidItemId));
    const touched = items.filter((i) => touchedIds.has(i.id));
    const before = currentContract(touched, applied).contractSumCents;
    applied.push(...co.changes);
    const after = currentContract(touched, applied).contractSumCents;
    lines.push({
      number: co.number,
      title: co.title,
      approvedAt: co.approvedAt,
      amountCents: subtractCents(after, before),
    });
  }
  const since = lines.filter((l) => previousAsOf === null || time(l.approvedAt) > time(previousAsOf));
  return {
    approvedCount: lines.length,
    netChangeCents: sumCents(lines.map((l) => l.amountCents)),
    sinceLastCents: sumCents(since.map((l) => l.amountCents)),
    lines,
  };
}
