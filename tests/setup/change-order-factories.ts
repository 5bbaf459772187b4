import { randomUUID } from 'node:crypto';
import type { CreateChangeOrderInput } from '../../src/shared/schemas/change-order';
import type { PayAppStatus } from '../../src/shared/constants';
import type { Db } from '../../server/db/client';
import { payAppLines, payApps } from '../../server/db/schema';

export const quantityChange = (
  bidItemId: string,
  quantityDelta: number,
  title = 'Quantity change',
): CreateChangeOrderInput => ({
  title,
  reason: 'Field conditions',
  items: [{ kind: 'change_quantity', bidItemId, quantityDelta }],
});

let nextNumber = 1;

/**
 * A pay application row with one line per given item (this period's quantity), inserted directly: enough for
 * the variance watch and the trail, which read pay_app_lines; amounts are not checked here.
 */
export async function makePayApp(
  db: Db,
  projectId: string,
  createdByUserId: string,
  status: PayAppStatus,
  lines: { bidItemId: string; quantity: number }[],
  period: { start: string; end: string } = { start: '2026-03-01', end: '2026-03-31' },
) {
  const [app] = await db
    .insert(payApps)
    .values({
      projectId,
      number: nextNumber++,
      status,
      periodStart: period.start,
      periodEnd: period.end,
      retainageBps: 1000,
      createdByUserId,
    })
    .returning();
  if (lines.length > 0) {
    await db.insert(payAppLines).values(
      lines.map((l, i) => ({
        payAppId: app!.id,
        bidItemId: l.bidItemId,
        sortOrder: i,
        itemNumber: `L-${randomUUID().slice(0, 4)}`,
        description: 'line',
        payUnit: 'CY' as const,
        unitPriceCents: 100,
        contractQuantity: 0,
        previousQuantity: 0,
        thisPeriodQuantity: l.quantity,
        toDateQuantity: l.quantity,
        previousAmountCents: 0,
        thisPeriodAmountCents: l.quantity * 100,
        amountToDateCents: l.quantity * 100,
        retainageCents: 0,
      })),
    );
  }
  return app!;
}
