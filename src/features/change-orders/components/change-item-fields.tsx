import { Trash2 } from 'lucide-react';
import { useWatch, type FieldErrors, type UseFormReturn } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { optionsOf, Select } from '@/components/ui/select';
import { formatMoney, formatQuantity } from '@/lib/format';
import { CHANGE_ORDER_ITEM_KINDS, MEASUREMENT_METHOD_LABELS, MEASUREMENT_METHODS, PAY_UNITS } from '@/shared/constants';
import type { ScheduleItem } from '../api/change-orders';
import { KIND_LABELS } from './change-order-words';
import type { ProposeFormOutput, ProposeFormValues } from './propose-form-schema';

/** The message at a dotted path of the form's errors (the server's own field names included). */
function errorAt(errors: FieldErrors<ProposeFormValues>, ...paths: string[]): string | undefined {
  for (const path of paths) {
    let node: unknown = errors;
    for (const key of path.split('.')) node = (node as Record<string, unknown> | undefined)?.[key];
    const message = (node as { message?: string } | undefined)?.message;
    if (message) return message;
  }
  return undefined;
}

type Props = {
  form: UseFormReturn<ProposeFormValues, unknown, ProposeFormOutput>;
  index: number;
  items: readonly ScheduleItem[];
  onRemove?: () => void;
};

/** One change of a change order: its kind, then the fields that kind needs. */
export function ChangeItemFields({ form, index, items, onRemove }: Props) {
  const at = (name: string) => `items.${index}.${name}` as const;
  const kind = useWatch({ control: form.control, name: `items.${index}.kind` });
  const bidItemId = useWatch({ control: form.control, name: `items.${index}.bidItemId` });
  const errors = form.formState.errors;
  const err = (...names: string[]) => errorAt(errors, ...names.map(at));
  const chosen = items.find((i) => i.id === bidItemId);
  const register = (name: string) => form.register(at(name) as `items.${number}.bidItemId`);
  return (
    <fieldset className="grid grid-cols-6 gap-x-3 gap-y-2 rounded-md border border-stone-200 p-3">
      <legend className="px-1 text-xs font-medium text-stone-600">Change {index + 1}</legend>
      <Field label="What changes" className="col-span-3">
        {(control) => (
          <Select
            {...control}
            {...register('kind')}
            options={optionsOf(CHANGE_ORDER_ITEM_KINDS, (k) => KIND_LABELS[k])}
          />
        )}
      </Field>
      <div className="col-span-3 flex items-end justify-end">
        {onRemove ? (
          <Button variant="ghost" size="sm" onClick={onRemove} aria-label={`Remove change ${index + 1}`}>
            <Trash2 aria-hidden /> Remove
          </Button>
        ) : null}
      </div>
      {kind === 'add_item' ? (
        <>
          <Field label="Item number" error={err('newItem.itemNumber')} className="col-span-2">
            {(c) => <Input {...c} {...register('newItem.itemNumber')} />}
          </Field>
          <Field label="Description" error={err('newItem.description')} className="col-span-4">
            {(c) => <Input {...c} {...register('newItem.description')} />}
          </Field>
          <Field label="Pay unit" className="col-span-2">
            {(c) => (
              <Select
                {...c}
                {...register('newItem.payUnit')}
                options={PAY_UNITS.map((u) => ({ value: u, label: u }))}
              />
            )}
          </Field>
          <Field label="Quantity" error={err('newItem.contractQuantity')} className="col-span-2">
            {(c) => <Input inputMode="decimal" className="num" {...c} {...register('newItem.contractQuantity')} />}
          </Field>
          <Field
            label="Unit price ($)"
            error={err('newItem.unitPrice', 'newItem.unitPriceCents')}
            className="col-span-2"
          >
            {(c) => (
              <Input inputMode="decimal" className="num" placeholder="0.00" {...c} {...register('newItem.unitPrice')} />
            )}
          </Field>
          <Field label="Measured by" className="col-span-6">
            {(c) => (
              <Select
                {...c}
                {...register('newItem.method')}
                options={optionsOf(MEASUREMENT_METHODS, (m) => MEASUREMENT_METHOD_LABELS[m])}
              />
            )}
          </Field>
        </>
      ) : (
        <>
          <Field label="Bid item" error={err('bidItemId')} className="col-span-4">
            {(c) => (
              // Controlled by the form's value: the item arrives preselected (?propose=<item>) before the list
              // loads, and an uncontrolled select would show its placeholder while the form holds the item.
              <Select
                {...c}
                {...register('bidItemId')}
                value={bidItemId ?? ''}
                options={items.map((i) => ({ value: i.id, label: `${i.itemNumber} · ${i.description}` }))}
              >
                <option value="">Choose a bid item…</option>
              </Select>
            )}
          </Field>
          {kind === 'change_quantity' ? (
            <Field
              label={`Change (${chosen?.payUnit ?? 'unit'}, minus to reduce)`}
              error={err('quantityDelta')}
              hint={
                chosen
                  ? `Contract quantity now ${formatQuantity(chosen.currentContractQuantity, chosen.payUnit)}`
                  : undefined
              }
              className="col-span-2"
            >
              {(c) => (
                <Input
                  inputMode="decimal"
                  className="num"
                  placeholder="+250 or -40"
                  {...c}
                  {...register('quantityDelta')}
                />
              )}
            </Field>
          ) : (
            <Field
              label={`New unit price ($ per ${chosen?.payUnit ?? 'unit'})`}
              error={err('unitPrice', 'newUnitPriceCents')}
              hint={chosen ? `Now ${formatMoney(chosen.unitPriceCents)}` : undefined}
              className="col-span-2"
            >
              {(c) => (
                <Input inputMode="decimal" className="num" placeholder="0.00" {...c} {...register('unitPrice')} />
              )}
            </Field>
          )}
        </>
      )}
    </fieldset>
  );
}
