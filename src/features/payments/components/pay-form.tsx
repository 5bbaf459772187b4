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
import { parseDollarsToCents } from '@/shared/parse-money';
import type { PayablePayAppView } from '@/shared/schemas/payment';
import { useStartPayment } from '../api/start-payment';

const payFormSchema = z.object({ part: z.enum(['balance', 'partial']), amount: z.string() });
type PayFormValues = z.infer<typeof payFormSchema>;

/**
 * The owner's payment step for one certified application: the balance comes from the server; where the project
 * allows it, a smaller amount may be entered. Card or ACH is chosen on the processor's page that follows.
 */
export function PayForm({ payApp }: { payApp: PayablePayAppView }) {
  const start = useStartPayment(payApp.id);
  const [formError, setFormError] = useState<string | null>(null);
  const [reauth, setReauth] = useState<ApiError | null>(null);
  const [password, setPassword] = useState('');
  const form = useForm<PayFormValues>({ resolver: zodResolver(payFormSchema), defaultValues: { part: 'balance', amount: '' } });
  const part = useWatch({ control: form.control, name: 'part' });

  const submit = form.handleSubmit(async ({ part: which, amount }) => {
    setFormError(null);
    let cents: number | undefined;
    if (which === 'partial') {
      const parsed = parseDollarsToCents(amount);
      if (parsed === null || parsed <= 0) return form.setError('amount', { message: 'Enter dollars and cents, e.g. 5,000.00.' });
      if (parsed > payApp.balanceCents) return form.setError('amount', { message: `At most the balance, ${formatMoney(payApp.balanceCents)}.` });
      cents = parsed;
    }
    try {
      const { url } = await start.mutateAsync({ partialAmountCents: cents, reauthPassword: reauth ? password : undefined });
      window.location.assign(url);
    } catch (err) {
      if (isReauthError(err)) return setReauth(err);
      const left = applyServerErrors(err, form.setError, ['amount'], { partialAmountCents: 'amount' });
      if (left.length > 0 || !form.formState.errors.amount) setFormError(errorMessage(err));
    }
  });

  return (
    <form aria-label={`Pay application ${payApp.number}`} onSubmit={submit} className="flex flex-col gap-3" noValidate>
      {payApp.allowPartialPayments ? (
        <fieldset className="flex flex-col gap-1.5 text-sm">
          <legend className="mb-1 text-xs font-medium text-stone-700">Amount</legend>
          <label className="flex items-center gap-2">
            <input type="radio" value="balance" {...form.register('part')} /> The whole balance, {formatMoney(payApp.balanceCents)}
          </label>
          <label className="flex items-center gap-2">
            <input type="radio" value="partial" {...form.register('part')} /> Part of it (this contract allows partial payments)
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
      <p className="text-xs text-stone-600">
        On the next page you choose a card (settles at once) or an ACH debit from a bank account (shows “Processing” until
        the bank confirms, usually within four business days). The application counts as paid only once the money has
        settled. Payment terms follow your contract; Tallyard is not legal or financial advice.
      </p>
      {reauth ? <ReauthPassword value={password} onChange={setPassword} error={reauth} /> : null}
      {formError ? <Alert>{formError}</Alert> : null}
      <div>
        <Button type="submit" disabled={start.isPending || start.isSuccess || (reauth !== null && password.length === 0)}>
          {start.isPending || start.isSuccess ? 'Opening checkout…' : 'Continue to payment'}
        </Button>
      </div>
    </form>
  );
}
