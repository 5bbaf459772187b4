import { Receipt } from 'lucide-react';
import { Select } from '@/components/ui/select';
import { formatQuantity } from '@/lib/format';
import { MEASUREMENT_METHOD_LABELS, METHOD_BILLING, TALLY_COMPONENTS, type TallyComponent } from '@/shared/constants';
import type { BidItemView } from '@/shared/schemas/bid-item';
import type { BillPreview } from '../lib/bill-preview';
import type { WorksheetMethod } from '../lib/types';

export type BillChoice = { bidItemId: string; component: TallyComponent | ''; density: string };

type BillingBarProps = {
  method: WorksheetMethod;
  bidItems: readonly BidItemView[];
  choice: BillChoice;
  onChoice: (next: BillChoice) => void;
  preview: BillPreview | null;
  disabled?: boolean;
};

const itemLabel = (b: BidItemView) => `${b.itemNumber} · ${b.description} (${b.payUnit})`;

/** The one line that says what saving would bill. */
export function BillLine({ preview, item }: { preview: BillPreview | null; item: BidItemView | undefined }) {
  if (!item) return <p className="text-sm text-stone-600">Choose the bid item this measurement bills.</p>;
  // The item's measurement profile pays it another way (tickets, steps, settings): the tally would bill nothing.
  if (item.talliesNotBilled)
    return (
      <p className="text-sm text-clay-800" role="status" data-testid="bill-line">
        Item {item.itemNumber} is {item.talliesNotBilled}.
      </p>
    );
  if (!preview) return <p className="text-sm text-stone-600">No quantity yet: the inputs need attention.</p>;
  if (preview.problem)
    return (
      <p className="text-sm text-brick-700" role="alert">
        {preview.problem.message}
      </p>
    );
  return (
    <p className="text-sm text-stone-800" data-testid="bill-line">
      Bills{' '}
      <strong className="num text-spruce-800">
        {formatQuantity(preview.bill.quantity, preview.bill.unit, preview.bill.basis)}
      </strong>{' '}
      to item <strong>{item.itemNumber}</strong> · {item.description}
    </p>
  );
}

/** Which bid item (and which part, and at what density) the worksheet bills, with the live billed quantity. */
export function BillingBar({ method, bidItems, choice, onChoice, preview, disabled }: BillingBarProps) {
  const billing = METHOD_BILLING[method];
  if (!billing.bills)
    return <p className="rounded-md bg-stone-100 px-3 py-2 text-xs text-stone-600">{billing.reason}</p>;
  const matching = bidItems.filter((b) => b.method === method);
  const others = bidItems.filter((b) => b.method !== method);
  const item = bidItems.find((b) => b.id === choice.bidItemId);
  const weight = item?.payUnit === 'TON' || item?.payUnit === 't';
  return (
    <section
      aria-label="Billing"
      className="flex flex-wrap items-end gap-3 rounded-md border border-spruce-200 bg-spruce-50 px-3 py-2"
    >
      <Receipt aria-hidden className="mb-2 size-4 text-spruce-700" />
      <label className="flex flex-col text-xs text-stone-700">
        Bills item
        <Select
          className="mt-0.5 w-80"
          value={choice.bidItemId}
          disabled={disabled}
          onChange={(e) => onChoice({ ...choice, bidItemId: e.target.value })}
        >
          <option value="">Choose a bid item…</option>
          {matching.length ? (
            <optgroup label={`Measured by ${MEASUREMENT_METHOD_LABELS[method].toLowerCase()}`}>
              {matching.map((b) => (
                <option key={b.id} value={b.id}>
                  {itemLabel(b)}
                </option>
              ))}
            </optgroup>
          ) : null}
          {others.length ? (
            <optgroup label="Other items">
              {others.map((b) => (
                <option key={b.id} value={b.id}>
                  {itemLabel(b)}
                </option>
              ))}
            </optgroup>
          ) : null}
        </Select>
      </label>
      {billing.components.length ? (
        <label className="flex flex-col text-xs text-stone-700">
          Part billed
          <Select
            className="mt-0.5 w-48"
            value={choice.component}
            disabled={disabled}
            onChange={(e) => onChoice({ ...choice, component: e.target.value as TallyComponent | '' })}
          >
            <option value="">By the item’s basis</option>
            {TALLY_COMPONENTS.map((c) => (
              <option key={c} value={c}>
                {c === 'cut' ? 'The cut' : 'The fill'}
              </option>
            ))}
          </Select>
        </label>
      ) : null}
      {weight ? (
        <label className="flex flex-col text-xs text-stone-700">
          Density ({item.payUnit === 'TON' ? 'tons per bank CY' : 'tonnes per bank m3'})
          <input
            className="mt-0.5 h-9 w-32 rounded-md border border-stone-300 bg-white px-2 num text-right text-sm"
            inputMode="decimal"
            value={choice.density}
            disabled={disabled}
            onChange={(e) => onChoice({ ...choice, density: e.target.value })}
          />
        </label>
      ) : null}
      <div className="min-w-64 flex-1 pb-1.5">
        <BillLine preview={preview} item={item} />
      </div>
    </section>
  );
}
