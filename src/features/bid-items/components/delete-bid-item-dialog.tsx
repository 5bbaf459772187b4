import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { errorMessage } from '@/lib/api-client';
import { formatMoney, formatQuantity } from '@/lib/format';
import type { BidItemView } from '@/shared/schemas/bid-item';
import { useDeleteBidItem } from '../api/save-bid-item';

type DeleteBidItemDialogProps = { item: BidItemView | undefined; onClose: () => void; onDeleted: () => void };

/** Asks before removing a bid item, naming it and its amount. */
export function DeleteBidItemDialog({ item, onClose, onDeleted }: DeleteBidItemDialogProps) {
  const remove = useDeleteBidItem();
  const close = () => {
    remove.reset();
    onClose();
  };
  return (
    <Dialog
      open={Boolean(item)}
      onClose={close}
      title="Delete this bid item?"
      className="w-[min(28rem,calc(100vw-2rem))]"
    >
      {item ? (
        <div className="flex flex-col gap-3">
          <p>
            <span className="font-semibold">{item.itemNumber}</span> {item.description}:{' '}
            <span className="tabular-nums">{formatQuantity(item.contractQuantity, item.payUnit)}</span> for{' '}
            <span className="tabular-nums">{formatMoney(item.contractAmountCents)}</span>. It leaves the bid schedule
            and the contract sum.
          </p>
          {remove.isError ? <Alert>{errorMessage(remove.error)}</Alert> : null}
          <div className="flex justify-end gap-2 border-t border-stone-200 pt-3">
            <Button variant="secondary" onClick={close}>
              Keep it
            </Button>
            <Button
              variant="danger"
              disabled={remove.isPending}
              onClick={() =>
                remove.mutate(item.id, {
                  onSuccess: () => {
                    remove.reset();
                    onDeleted();
                  },
                })
              }
            >
              {remove.isPending ? 'Deleting…' : 'Delete bid item'}
            </Button>
          </div>
        </div>
      ) : null}
    </Dialog>
  );
}
