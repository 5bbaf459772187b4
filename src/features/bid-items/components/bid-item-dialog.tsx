import { Dialog } from '@/components/ui/dialog';
import type { UnitSystem } from '@/shared/constants';
import type { BidItemView } from '@/shared/schemas/bid-item';
import { useSaveBidItem } from '../api/save-bid-item';
import { BidItemForm } from './bid-item-form';
import { bidItemFormDefaults } from './bid-item-form-schema';

type BidItemDialogProps = {
  projectId: string;
  units: UnitSystem;
  open: boolean;
  /** The item to edit; none to add a new one. */
  item: BidItemView | undefined;
  onClose: () => void;
  onSaved: (item: BidItemView) => void;
};

export function BidItemDialog({ projectId, units, open, item, onClose, onSaved }: BidItemDialogProps) {
  const save = useSaveBidItem(projectId, item?.id);
  return (
    <Dialog
      open={open}
      onClose={onClose}
      title={item ? `Edit bid item ${item.itemNumber}` : 'Add a bid item'}
      description="Unit price in dollars and cents; the contract amount is quantity times unit price."
      className="w-[min(42rem,calc(100vw-2rem))]"
    >
      <BidItemForm
        key={item?.id ?? 'new'}
        defaultValues={bidItemFormDefaults(item, units)}
        submitLabel={item ? 'Save changes' : 'Add bid item'}
        onCancel={onClose}
        onSubmit={async (input) => onSaved(await save.mutateAsync(input))}
      />
    </Dialog>
  );
}
