import type { WaiverExceptionInput, WaiverExceptionView } from '../../../src/shared/schemas/payment';
import { changeOrderValues, disputedClaims, waiverExceptions } from '../../../src/shared/domain/waiver-exceptions';
import type { Executor } from '../../db/client';
import { loadContract } from '../change-orders/contract-quantities.repository';
import type { PayAppRow } from '../payments/payments.repository';
import * as repo from './lien-waivers.repository';

/**
 * The exceptions of a waiver on `app` (src/shared/domain/waiver-exceptions.ts): the application's retainage to
 * date, each disputed line's uncertified claim (the subcontractor's last own figure, disputedClaims), approved change
 * orders decided after the application's period (so none of their work is in it), and the signer's own.
 */
export async function exceptionsFor(
  db: Executor,
  app: PayAppRow,
  signerAdded: readonly WaiverExceptionInput[] = [],
): Promise<WaiverExceptionView[]> {
  const [disputed, approved, contract] = await Promise.all([
    repo.disputedLinesOf(db, app.id),
    repo.approvedChangeOrders(db, app.projectId),
    loadContract(db, app.projectId),
  ]);
  const values = changeOrderValues(contract.inputs.items, contract.inputs.changes);
  const periodEnd = `${app.periodEnd}T23:59:59.999Z`;
  const unpaid = approved
    .filter((co) => co.decidedAt !== null && co.decidedAt.toISOString() > periodEnd)
    .sort((a, b) => a.number - b.number)
    .map((co) => ({ number: co.number, title: co.title, amountCents: values.get(co.number) ?? 0 }));
  return waiverExceptions({
    retainageHeldCents: app.retainageCents,
    disputedLines: disputedClaims(disputed),
    unpaidChangeOrders: unpaid,
    signerAdded,
  });
}
