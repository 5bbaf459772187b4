import { ArrowRight } from 'lucide-react';
import { useState } from 'react';
import { Link } from 'react-router';
import { buttonVariants } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { cn } from '@/lib/cn';
import { MEASUREMENT_METHOD_LABELS, type MeasurementMethod, type PayUnit } from '@/shared/constants';
import type { TallyView } from '@/shared/schemas/tally';
import { DirectQuantityForm } from './direct-quantity-form';
import { worksheetOf } from './tally-labels';

export type BidItemChoice = {
  id: string;
  itemNumber: string;
  description: string;
  payUnit: PayUnit;
  method: MeasurementMethod;
};

type NewTallyFormProps = {
  projectId: string;
  bidItems: BidItemChoice[];
  onDone: (tally: TallyView) => void;
};

/**
 * "New tally": the bid item first. An item measured by a worksheet opens that worksheet with the item chosen (the
 * worksheet saves the tally, with its files); an item paid by count, lump sum or time gets the direct-quantity form.
 */
export function NewTallyForm({ projectId, bidItems, onDone }: NewTallyFormProps) {
  const [bidItemId, setBidItemId] = useState('');
  const item = bidItems.find((b) => b.id === bidItemId);
  const worksheet = item ? worksheetOf(item) : null;
  return (
    <div className="flex flex-col gap-4">
      <Field label="Bid item" hint="The item this measurement bills to">
        {(c) => (
          <Select
            {...c}
            value={bidItemId}
            onChange={(e) => setBidItemId(e.target.value)}
            options={bidItems.map((b) => ({ value: b.id, label: `${b.itemNumber} · ${b.description} (${b.payUnit})` }))}
          >
            <option value="">Choose a bid item…</option>
          </Select>
        )}
      </Field>
      {item && worksheet ? (
        <div className="flex flex-wrap items-center justify-between gap-3 rounded-md bg-stone-50 px-3 py-3 text-sm">
          <p className="text-stone-700">
            Item {item.itemNumber} is measured with the{' '}
            <span className="font-medium">{MEASUREMENT_METHOD_LABELS[worksheet]}</span> worksheet. Enter or load the
            measurement there and save it as this item’s tally.
          </p>
          <Link
            className={cn(buttonVariants({ variant: 'primary' }))}
            to={`/projects/${encodeURIComponent(projectId)}/worksheets?method=${worksheet}&item=${encodeURIComponent(item.id)}`}
          >
            Open the worksheet <ArrowRight aria-hidden />
          </Link>
        </div>
      ) : null}
      {item && !worksheet ? (
        <>
          <p className="text-sm text-stone-700">
            Item {item.itemNumber} is paid by {item.payUnit}: state the quantity, what it rests on, and attach the
            evidence.
          </p>
          <DirectQuantityForm projectId={projectId} item={item} onDone={onDone} />
        </>
      ) : null}
    </div>
  );
}
