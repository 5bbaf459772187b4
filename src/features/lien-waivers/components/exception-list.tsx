import { formatMoney } from '@/lib/format';
import type { WaiverExceptionView } from '@/shared/schemas/payment';

const LABELS: Record<WaiverExceptionView['kind'], string> = {
  retainage_held: 'Retainage held',
  disputed: 'Disputed',
  change_order_unpaid: 'Change order',
  signer_added: 'Added by signer',
};

/** A waiver's exceptions: kind, what, amount; "None" when there are none. */
export function ExceptionList({ exceptions }: { exceptions: WaiverExceptionView[] }) {
  if (exceptions.length === 0) return <p className="text-sm text-stone-600">No exceptions.</p>;
  return (
    <ul className="flex flex-col divide-y divide-stone-200 rounded-md border border-stone-200 bg-white text-sm">
      {exceptions.map((e, i) => (
        <li key={i} className="grid grid-cols-[8rem_1fr_auto] gap-3 px-3 py-1.5">
          <span className="font-medium text-stone-700">{LABELS[e.kind]}</span>
          <span className="text-stone-700">{e.description}</span>
          <span className="text-right tabular-nums">{formatMoney(e.amountCents)}</span>
        </li>
      ))}
    </ul>
  );
}
