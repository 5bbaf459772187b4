import { and, eq } from 'drizzle-orm';
import { recordAudit } from '../../modules/audit/audit.repository';
import type { Db } from '../client';
import { payApps, payAppStatusHistory, paymentStatusHistory, payments } from '../schema';

/**
 * The demo's first period was paid by ACH before the demo begins: a succeeded payment of the current due and the
 * application moved certified -> paid, in one transaction with its audit event. (Real payments go through the
 * payments module and Stripe events; the demo has no Stripe history to replay.)
 */
export async function markPaid(db: Db, projectId: string, payAppId: string, amountCents: number, ownerUserId: string) {
  await db.transaction(async (tx) => {
    const settledAt = new Date();
    const [payment] = await tx
      .insert(payments)
      .values({ projectId, payAppId, amountCents, method: 'us_bank_account', status: 'succeeded', idempotencyKey: `demo-${payAppId}`, settledAt, createdByUserId: ownerUserId })
      .returning();
    await tx.insert(paymentStatusHistory).values([
      { paymentId: payment!.id, fromStatus: null, toStatus: 'processing', note: 'Demo: ACH debit started' },
      { paymentId: payment!.id, fromStatus: 'processing', toStatus: 'succeeded', note: 'Demo: ACH debit settled' },
    ]);
    const [app] = await tx
      .update(payApps)
      .set({ status: 'paid', paidCents: amountCents })
      .where(and(eq(payApps.id, payAppId), eq(payApps.status, 'certified')))
      .returning();
    if (!app) throw new Error('demo: the first pay application is not certified');
    await tx.insert(payAppStatusHistory).values({ payAppId, fromStatus: 'certified', toStatus: 'paid', revision: app.revision, note: 'Paid by ACH (demo history)', actorUserId: null });
    await recordAudit(tx, {
      projectId,
      actorUserId: ownerUserId,
      objectType: 'payment',
      objectId: payment!.id,
      action: 'payment.succeeded',
      after: { payAppId, amountCents, method: 'us_bank_account', status: 'succeeded' },
    });
  });
}
