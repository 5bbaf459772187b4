import { storedAccount } from '../../../src/shared/domain/provisions/stored-materials';
import type { StoredMaterialView } from '../../../src/shared/schemas/provisions/views';
import type { MovementRow, StoredMaterialRow } from './stored-materials.repository';

/** Movements before `from` are previous; from `from` to `to` this period; after `to` not yet counted. */
export function periodOf(movedOn: string, from: string | undefined, to: string | undefined): number {
  if (from && movedOn < from) return 1;
  if (to && movedOn > to) return 3;
  return 2;
}

export function presentMaterial(
  r: StoredMaterialRow,
  moves: MovementRow[],
  from?: string,
  to?: string,
): StoredMaterialView {
  const own = moves.filter((m) => m.storedMaterialId === r.id);
  const account = storedAccount(
    { unitCostCents: r.unitCostCents, neededQuantity: r.neededQuantity },
    own.map((m) => ({ kind: m.kind, quantity: m.quantity, period: periodOf(m.movedOn, from, to) })),
    2,
  );
  return {
    id: r.id,
    bidItemId: r.bidItemId,
    description: r.description,
    unit: r.unit,
    unitCostCents: r.unitCostCents,
    neededQuantity: r.neededQuantity,
    storedAt: r.storedAt,
    movements: own.map((m) => ({
      id: m.id,
      kind: m.kind,
      movedOn: m.movedOn,
      quantity: m.quantity,
      invoiceRef: m.invoiceRef,
    })),
    account,
  };
}
