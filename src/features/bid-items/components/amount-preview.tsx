import { useWatch, type Control } from 'react-hook-form';
import { formatMoney } from '@/lib/format';
import { lineAmountCents } from '@/shared/domain/money';
import { parseDollarsToCents } from '@/shared/parse-money';
import type { BidItemFormInput, BidItemFormOutput } from './bid-item-form-schema';

/** The contract amount as the server will compute it (same function), while the person types. */
export function AmountPreview({ control }: { control: Control<BidItemFormInput, unknown, BidItemFormOutput> }) {
  const [priceText, quantityText] = useWatch({ control, name: ['unitPrice', 'contractQuantity'] });
  const cents = parseDollarsToCents(priceText ?? '');
  const quantity = Number((quantityText ?? '').replace(/,/g, ''));
  const valid = cents !== null && quantityText?.trim() && Number.isFinite(quantity) && quantity >= 0;
  return (
    <p className="text-sm text-stone-600" aria-live="polite">
      Contract amount{' '}
      <span className="font-semibold text-stone-900 tabular-nums">
        {valid ? formatMoney(lineAmountCents(quantity, cents)) : '—'}
      </span>
    </p>
  );
}
