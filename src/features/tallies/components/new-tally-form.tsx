import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { Select } from '@/components/ui/select';
import { errorMessage, isApiError } from '@/lib/api-client';
import { MEASUREMENT_METHOD_LABELS, type MeasurementMethod, type PayUnit } from '@/shared/constants';
import { createTallySchema, type TallyView } from '@/shared/schemas/tally';
import { useCreateTally, useUpdateTally } from '../api/save-tally';
import { EXAMPLE_INPUTS, TALLY_METHODS } from './tally-labels';

export type BidItemChoice = { id: string; itemNumber: string; description: string; payUnit: PayUnit; method: MeasurementMethod };
type Errors = Record<string, string>;

const today = () => new Date().toISOString().slice(0, 10);
const exampleFor = (method: MeasurementMethod) => JSON.stringify(EXAMPLE_INPUTS[method] ?? {}, null, 2);

type TallyFormProps = {
  projectId: string;
  bidItems: BidItemChoice[];
  onDone: (tally: TallyView) => void;
  /** A draft to edit; without it the form makes a new tally. */
  tally?: TallyView;
};

const valuesOf = (tally: TallyView) => ({
  title: tally.title,
  measuredOn: tally.measuredOn,
  inputs: tally.inputs ? JSON.stringify(tally.inputs, null, 2) : exampleFor(tally.method),
  quantity: tally.method === 'manual' ? String(tally.quantity) : '',
  manualBasis: tally.manualBasis ?? '',
  component: '',
});

/**
 * A new tally, or a draft's edit: bid item, date, and either a worksheet's inputs (JSON, the calc API body; the
 * worksheet screens may fill it later) or a manual quantity with its written basis. The server computes the quantity.
 */
export function NewTallyForm({ projectId, bidItems, onDone, tally }: TallyFormProps) {
  const first = tally ? bidItems.find((b) => b.id === tally.bidItem.id) : bidItems[0];
  const [bidItemId, setBidItemId] = useState(first?.id ?? '');
  const [method, setMethod] = useState<MeasurementMethod>(tally ? tally.method : first && (TALLY_METHODS as readonly string[]).includes(first.method) ? first.method : 'manual');
  const [values, setValues] = useState(() => (tally ? valuesOf(tally) : { title: '', measuredOn: today(), inputs: exampleFor(method), quantity: '', manualBasis: '', component: '' }));
  const [errors, setErrors] = useState<Errors>({});
  const created = useCreateTally(projectId);
  const updated = useUpdateTally(tally?.id ?? '');
  const create = tally ? updated : created;
  const item = bidItems.find((b) => b.id === bidItemId);
  const methodOf = (b: BidItemChoice | undefined): MeasurementMethod => (b && (TALLY_METHODS as readonly string[]).includes(b.method) ? b.method : 'manual');
  const chooseMethod = (next: MeasurementMethod) => {
    setMethod(next);
    setValues((v) => ({ ...v, inputs: exampleFor(next) }));
  };
  const chooseItem = (id: string) => {
    setBidItemId(id);
    chooseMethod(methodOf(bidItems.find((b) => b.id === id)));
  };
  const set = (key: keyof typeof values) => (e: { target: { value: string } }) => setValues((v) => ({ ...v, [key]: e.target.value }));

  function submit(event: React.FormEvent) {
    event.preventDefault();
    let inputs: Record<string, unknown> | undefined;
    if (method !== 'manual') {
      try {
        inputs = JSON.parse(values.inputs) as Record<string, unknown>;
      } catch (err) {
        setErrors({ inputs: `The inputs are not valid JSON: ${errorMessage(err)}` });
        return;
      }
    }
    const body = {
      bidItemId,
      measuredOn: values.measuredOn,
      title: values.title,
      method,
      ...(method === 'manual' ? { quantity: values.quantity === '' ? undefined : Number(values.quantity), manualBasis: values.manualBasis } : { inputs }),
      ...(values.component ? { component: values.component as 'cut' | 'fill' } : {}),
    };
    const parsed = createTallySchema.safeParse(body);
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0] ?? 'form'), i.message])));
      return;
    }
    setErrors({});
    create.mutate(parsed.data, {
      onSuccess: onDone,
      onError: (err) => {
        if (isApiError(err) && err.details.length) setErrors(Object.fromEntries(err.details.map((d) => [d.path.split('.')[0] ?? 'form', d.path.includes('.') ? `${d.path}: ${d.message}` : d.message])));
      },
    });
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field label="Bid item" error={errors.bidItemId}>
          {(c) => <Select {...c} value={bidItemId} onChange={(e) => chooseItem(e.target.value)} options={bidItems.map((b) => ({ value: b.id, label: `${b.itemNumber} · ${b.description} (${b.payUnit})` }))} />}
        </Field>
        <Field label="Measured on" error={errors.measuredOn}>
          {(c) => <Input {...c} type="date" value={values.measuredOn} onChange={set('measuredOn')} />}
        </Field>
        <Field label="Title" hint="What was measured, e.g. “North basin, stations 12+00 to 13+00”" error={errors.title}>
          {(c) => <Input {...c} value={values.title} onChange={set('title')} />}
        </Field>
        <Field label="Method" error={errors.method}>
          {(c) => (
            <Select
              {...c}
              value={method}
              onChange={(e) => chooseMethod(e.target.value as MeasurementMethod)}
              options={TALLY_METHODS.map((m) => ({ value: m, label: MEASUREMENT_METHOD_LABELS[m] }))}
            />
          )}
        </Field>
      </div>
      {method === 'manual' ? (
        <div className="grid gap-3 sm:grid-cols-[12rem_1fr]">
          <Field label={`Quantity${item ? ` (${item.payUnit})` : ''}`} error={errors.quantity}>
            {(c) => <Input {...c} inputMode="decimal" className="text-right tabular-nums" value={values.quantity} onChange={set('quantity')} />}
          </Field>
          <Field label="Written basis" hint="Where the number comes from: tickets, an as-built, a survey; at least 10 characters." error={errors.manualBasis}>
            {(c) => <textarea {...c} rows={3} className="rounded-md border border-stone-300 px-2 py-1.5 text-sm" value={values.manualBasis} onChange={set('manualBasis')} />}
          </Field>
        </div>
      ) : (
        <>
          <Field label="Worksheet inputs (JSON)" hint="The body of the calculation API for this method; lengths in ft give CY, in m give m³." error={errors.inputs}>
            {(c) => <textarea {...c} rows={9} spellCheck={false} className="rounded-md border border-stone-300 px-2 py-1.5 font-mono text-xs" value={values.inputs} onChange={set('inputs')} />}
          </Field>
          {['end-area', 'grid', 'surface'].includes(method) ? (
            <Field label="Bill" error={errors.component} className="max-w-xs">
              {(c) => <Select {...c} value={values.component} onChange={set('component')} options={[{ value: '', label: 'By the item’s basis (cut for bank, fill for compacted)' }, { value: 'cut', label: 'The cut' }, { value: 'fill', label: 'The fill' }]} />}
            </Field>
          ) : null}
        </>
      )}
      {create.isError ? <Alert>{errorMessage(create.error)}</Alert> : null}
      <div className="flex justify-end gap-2">
        <Button type="submit" disabled={create.isPending || !bidItemId}>
          {create.isPending ? 'Computing…' : tally ? 'Save changes' : 'Save draft tally'}
        </Button>
      </div>
    </form>
  );
}
