import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { errorMessage } from '@/lib/api-client';
import { formatMoney, formatPercentBps } from '@/lib/format';
import { applyServerErrors } from '@/lib/form-errors';
import { FEE_BEARERS, PAYMENT_METHODS, type FeeBearer, type PaymentMethod } from '@/shared/constants';
import { feeQuote, type FeeRates } from '@/shared/domain/payment-fees';
import { projectSettingsSchema } from '@/shared/schemas/project';
import { useSetFeeBearer } from '../api/set-fee-bearer';

const schema = projectSettingsSchema.pick({ processingFeeBearer: true });
type Values = { processingFeeBearer: FeeBearer };

const BEARER_WORDS: Record<FeeBearer, { name: string; detail: string }> = {
  payer: {
    name: 'The payer bears it',
    detail: 'The fee is added to the charge, so the subcontractor receives the whole amount applied.',
  },
  payee: {
    name: 'The payee absorbs it',
    detail: 'The payer is charged the amount applied; the fee comes out of what the subcontractor receives.',
  },
};
const METHOD_NAMES: Record<PaymentMethod, string> = { card: 'Card', us_bank_account: 'ACH bank debit' };
/** A round figure for the example table (our own choice of illustration). */
const EXAMPLE_CENTS = 1_000_000;

/** The schedule in words, as the server's rates say it. */
function rateText(method: PaymentMethod, rates: FeeRates): string {
  if (method === 'card') {
    const r = rates.card;
    return `${formatPercentBps(r.percentBps)} of the charge${r.fixedCents > 0 ? ` + ${formatMoney(r.fixedCents)}` : ''}`;
  }
  const r = rates.us_bank_account;
  return `${formatPercentBps(r.percentBps)} of the charge, at most ${formatMoney(r.capCents)}`;
}

function FeeSchedule({ rates }: { rates: FeeRates }) {
  // Wider than a phone: it scrolls inside its own box (relative, so nothing in it can widen the page).
  return (
    <div className="relative overflow-x-auto">
      <table className="w-full text-sm" aria-label="Processing fee schedule">
        <thead>
          <tr className="border-b border-stone-200 text-left text-xs text-stone-600">
            <th className="py-1 pr-3 font-medium">Method</th>
            <th className="py-1 pr-3 font-medium">Fee per charge</th>
            <th className="py-1 pr-3 text-right font-medium whitespace-nowrap">Payer bears it: charged / received</th>
            <th className="py-1 text-right font-medium whitespace-nowrap">Payee absorbs it: charged / received</th>
          </tr>
        </thead>
        <tbody>
          {PAYMENT_METHODS.map((m) => {
            const payer = feeQuote(EXAMPLE_CENTS, m, 'payer', rates);
            const payee = feeQuote(EXAMPLE_CENTS, m, 'payee', rates);
            return (
              <tr key={m} className="border-b border-stone-100">
                <th scope="row" className="py-1.5 pr-3 text-left font-medium whitespace-nowrap">
                  {METHOD_NAMES[m]}
                </th>
                <td className="py-1.5 pr-3">{rateText(m, rates)}</td>
                <td className="py-1.5 pr-3 text-right whitespace-nowrap tabular-nums">
                  {formatMoney(payer.chargeCents)} / {formatMoney(payer.netCents)}
                </td>
                <td className="py-1.5 text-right whitespace-nowrap tabular-nums">
                  {formatMoney(payee.chargeCents)} / {formatMoney(payee.netCents)}
                </td>
              </tr>
            );
          })}
        </tbody>
        <caption className="caption-bottom pt-1.5 text-left text-xs text-stone-600">
          Example: a payment of {formatMoney(EXAMPLE_CENTS)} applied to a pay application. The rates are this server’s
          configuration of the processor’s pricing; a negotiated account may differ.
        </caption>
      </table>
    </div>
  );
}

/**
 * Who bears card and ACH processing fees on this project, with the fee schedule the server charges by. The general
 * contractor's side (who manages the contract) changes it; everyone else reads it.
 */
export function FeeBearerCard({
  projectId,
  bearer,
  rates,
  canEdit,
}: {
  projectId: string;
  bearer: FeeBearer;
  rates: FeeRates;
  canEdit: boolean;
}) {
  const save = useSetFeeBearer(projectId);
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const form = useForm<Values>({ resolver: zodResolver(schema), values: { processingFeeBearer: bearer } });
  const chosen = useWatch({ control: form.control, name: 'processingFeeBearer' });
  const submit = form.handleSubmit(async (values) => {
    setFormError(null);
    setSaved(false);
    try {
      await save.mutateAsync(values.processingFeeBearer);
      setSaved(true);
    } catch (err) {
      const left = applyServerErrors(err, form.setError, ['processingFeeBearer']);
      if (left.length > 0 || !form.formState.errors.processingFeeBearer) setFormError(errorMessage(err));
    }
  });
  return (
    <Card aria-labelledby="fee-bearer-title">
      <CardHeader>
        <CardTitle id="fee-bearer-title">Processing fees</CardTitle>
      </CardHeader>
      <CardBody className="flex flex-col gap-4">
        {canEdit ? (
          <form onSubmit={submit} className="flex flex-col gap-3" aria-label="Who bears processing fees" noValidate>
            <fieldset className="flex flex-col gap-1.5 text-sm">
              <legend className="mb-1 text-xs font-medium text-stone-700">
                Who bears card and ACH processing fees
              </legend>
              {FEE_BEARERS.map((b) => (
                <label
                  key={b}
                  className="flex items-start gap-2 rounded-md border border-stone-200 px-3 py-2 has-[:checked]:border-spruce-500 has-[:checked]:bg-spruce-50/50"
                >
                  <input type="radio" value={b} className="mt-1" {...form.register('processingFeeBearer')} />
                  <span className="flex flex-col">
                    <span className="font-medium">{BEARER_WORDS[b].name}</span>
                    <span className="text-xs text-stone-600">{BEARER_WORDS[b].detail}</span>
                  </span>
                </label>
              ))}
              {form.formState.errors.processingFeeBearer ? (
                <p className="text-xs text-red-700">{form.formState.errors.processingFeeBearer.message}</p>
              ) : null}
            </fieldset>
            {formError ? <Alert>{formError}</Alert> : null}
            {saved && chosen === bearer ? <Alert tone="success">Saved. New payments follow this setting.</Alert> : null}
            <div>
              <Button type="submit" disabled={save.isPending || chosen === bearer}>
                {save.isPending ? 'Saving…' : 'Save'}
              </Button>
            </div>
          </form>
        ) : (
          <p className="text-sm" data-testid="fee-bearer">
            <strong>{BEARER_WORDS[bearer].name}.</strong> {BEARER_WORDS[bearer].detail}{' '}
            <span className="text-stone-600">The general contractor sets this for the project.</span>
          </p>
        )}
        <FeeSchedule rates={rates} />
        <p className="text-xs text-stone-600">
          A payment keeps the setting it was started under. Card surcharges are limited by card network rules and, in
          some states, by law; the contract and the governing statute decide who may bear these costs. Tallyard is not
          legal or financial advice.
        </p>
      </CardBody>
    </Card>
  );
}
