import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { z } from 'zod';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { isReauthError, ReauthPassword } from '@/components/reauth-password';
import { errorMessage, type ApiError } from '@/lib/api-client';
import { formatMoney } from '@/lib/format';
import { applyServerErrors } from '@/lib/form-errors';
import { PAYMENT_METHODS, type PaymentMethod } from '@/shared/constants';
import { feeQuote } from '@/shared/domain/payment-fees';
import { parseDollarsToCents } from '@/shared/parse-money';
import type { PayablePayAppView } from '@/shared/schemas/payment';
import { useStartPayment } from '../api/start-payment';

const payFormSchema = z.object({
  part: z.enum(['balance', 'partial']),
  amount: z.string(),
  method: z
    .enum(PAYMENT_METHODS, { error: 'Choose card or ACH bank debit.' })
    .nullable()
    .refine((m) => m !== null, 'Choose card or ACH bank debit.'),
});
type PayFormValues = z.input<typeof payFormSchema>;

const METHOD_WORDS: Record<PaymentMethod, { name: string; timing: string }> = {
  card: { name: 'Card', timing: 'settles at once' },
  us_bank_account: {
    name: 'ACH bank debit',
    timing: 'shows “Processing” until the bank confirms, usually within four business days',
  },
};

/**
 * The owner's payment step for one certified application: the balance comes from the server; where the project
 * allows it, a smaller amount may be entered. The payer chooses card or ACH here and sees the processing fee and
 * the total before leaving for checkout (feeQuote with the server's rates; the server charges the same figures).
 */
export function PayForm({ payApp }: { payApp: PayablePayAppView }) {
  const start = useStartPayment(payApp.id);
  const [formError, setFormError] = useState<string | null>(null);
  const [reauth, setReauth] = useState<ApiError | null>(null);
  const [password, setPassword] = useState('');
  const form = useForm<PayFormValues>({
    resolver: zodResolver(payFormSchema),
    defaultValues: { part: 'balance', amount: '', method: null },
  });
  const [part, amountText, method] = useWatch({ control: form.control, name: ['part', 'amount', 'method'] });
  const typed = part === 'partial' ? parseDollarsToCents(amountText) : payApp.balanceCents;
  const amountCents = typed !== null && typed > 0 && typed <= payApp.balanceCents ? typed : null;
  const payerBears = payApp.feeBearer === 'payer';

  const submit = form.handleSubmit(async ({ part: which, amount, method: chosen }) => {
    setFormError(null);
    let cents: number | undefined;
    if (which === 'partial') {
      const parsed = parseDollarsToCents(amount);
      if (parsed === null || parsed <= 0)
        return form.setError('amount', { message: 'Enter dollars and cents, e.g. 5,000.00.' });
      if (parsed > payApp.balanceCents)
        return form.setError('amount', { message: `At most the balance, ${formatMoney(payApp.balanceCents)}.` });
      cents = parsed;
    }
    try {
      const { url } = await start.mutateAsync({
        method: chosen ?? undefined,
        partialAmountCents: cents,
        reauthPassword: reauth ? password : undefined,
      });
      window.location.assign(url);
    } catch (err) {
      if (isReauthError(err)) return setReauth(err);
      const left = applyServerErrors(err, form.setError, ['amount', 'method'], { partialAmountCents: 'amount' });
      if (left.length > 0 || (!form.formState.errors.amount && !form.formState.errors.method))
        setFormError(errorMessage(err));
    }
  });

  const chosenQuote =
    amountCents !== null && method ? feeQuote(amountCents, method, payApp.feeBearer, payApp.feeRates) : null;
  return (
    <form aria-label={`Pay application ${payApp.number}`} onSubmit={submit} className="flex flex-col gap-3" noValidate>
      {payApp.allowPartialPayments ? (
        <fieldset className="flex flex-col gap-1.5 text-sm">
          <legend className="mb-1 text-xs font-medium text-stone-700">Amount</legend>
          <label className="flex items-center gap-2">
            <input type="radio" value="balance" {...form.register('part')} /> The whole balance,{' '}
            {formatMoney(payApp.balanceCents)}
          </label>
          <label className="flex items-center gap-2">
            <input type="radio" value="partial" {...form.register('part')} /> Part of it (this contract allows partial
            payments)
          </label>
          {part === 'partial' ? (
            <Field label="Amount to pay now ($)" error={form.formState.errors.amount?.message} className="max-w-48">
              {(control) => <Input {...control} inputMode="decimal" placeholder="0.00" {...form.register('amount')} />}
            </Field>
          ) : null}
        </fieldset>
      ) : (
        <p className="text-sm">
          Amount to pay: <strong className="tabular-nums">{formatMoney(payApp.balanceCents)}</strong>
        </p>
      )}
      <fieldset
        className="flex flex-col gap-1.5 text-sm"
        aria-describedby={form.formState.errors.method ? `method-error-${payApp.id}` : undefined}
      >
        <legend className="mb-1 text-xs font-medium text-stone-700">How to pay</legend>
        {PAYMENT_METHODS.map((m) => {
          const q = amountCents !== null ? feeQuote(amountCents, m, payApp.feeBearer, payApp.feeRates) : null;
          return (
            <label
              key={m}
              className="flex items-start gap-2 rounded-md border border-stone-200 px-3 py-2 has-[:checked]:border-spruce-500 has-[:checked]:bg-spruce-50/50"
            >
              <input type="radio" value={m} className="mt-1" {...form.register('method')} />
              <span className="flex flex-col">
                <span className="font-medium">{METHOD_WORDS[m].name}</span>
                <span className="text-xs text-stone-600">
                  {q
                    ? payerBears
                      ? `Processing fee ${formatMoney(q.feeCents)} added; you are charged ${formatMoney(q.chargeCents)}.`
                      : `You are charged ${formatMoney(q.chargeCents)}; the processing fee of ${formatMoney(q.feeCents)} is absorbed by the payee.`
                    : 'Enter an amount to see the fee.'}{' '}
                  {`It ${METHOD_WORDS[m].timing}.`}
                </span>
              </span>
            </label>
          );
        })}
        {form.formState.errors.method ? (
          <p id={`method-error-${payApp.id}`} className="text-xs text-red-700">
            {form.formState.errors.method.message}
          </p>
        ) : null}
      </fieldset>
      {chosenQuote ? (
        <dl
          className="grid max-w-sm grid-cols-[1fr_auto] gap-x-4 gap-y-0.5 rounded-md bg-stone-50 px-3 py-2 text-sm"
          aria-label="What you are charged"
        >
          <dt className="text-stone-600">Applied to pay application {payApp.number}</dt>
          <dd className="text-right tabular-nums">{formatMoney(chosenQuote.amountCents)}</dd>
          <dt className="text-stone-600">Processing fee ({payerBears ? 'paid by you' : 'absorbed by the payee'})</dt>
          <dd className="text-right tabular-nums">{payerBears ? formatMoney(chosenQuote.feeCents) : formatMoney(0)}</dd>
          <dt className="font-medium">Total charged</dt>
          <dd className="text-right font-medium tabular-nums">{formatMoney(chosenQuote.chargeCents)}</dd>
        </dl>
      ) : null}
      <p className="text-xs text-stone-600">
        Who bears the processing fee is a setting of this project. Card surcharges are limited by card network rules
        and, in some states, by law; the contract and the governing statute decide. The application counts as paid only
        once the money has settled. Tallyard is not legal or financial advice.
      </p>
      {reauth ? <ReauthPassword value={password} onChange={setPassword} error={reauth} /> : null}
      {formError ? <Alert>{formError}</Alert> : null}
      <div>
        <Button
          type="submit"
          disabled={start.isPending || start.isSuccess || (reauth !== null && password.length === 0)}
        >
          {start.isPending || start.isSuccess ? 'Opening checkout…' : 'Continue to payment'}
        </Button>
      </div>
    </form>
  );
}
