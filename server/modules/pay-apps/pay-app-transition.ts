import { and, eq } from 'drizzle-orm';
import type { AccessRole, PayAppStatus } from '../../../src/shared/constants';
import { nextStatus, type PayAppAction } from '../../../src/shared/domain/pay-app-status';
import type { Executor } from '../../db/client';
import { payApps, payAppStatusHistory } from '../../db/schema';
import { AppError, forbidden } from '../../lib/app-error';
import { mayTake } from '../../../src/shared/policies/pay-apps';
import { findPayApp, type PayAppRow } from './pay-apps.repository';

const label = (s: string) => s.replace('_', ' ');
const DONE: Record<PayAppAction, string> = {
  submit: 'submitted',
  start_review: 'reviewed',
  return: 'returned',
  revise: 'revised',
  certify: 'certified',
  payment_started: 'paid',
  payment_partial: 'paid',
  payment_settled: 'paid',
  payment_reopened: 'reopened',
};

/** Role first (403), then the transition table (409 PAY_APP_WRONG_STATUS), then the revision (409 PAY_APP_STALE). */
export function checkAction(
  app: PayAppRow,
  action: PayAppAction,
  roles: AccessRole[],
  expectedRevision?: number,
): PayAppStatus {
  if (!mayTake(action, roles))
    throw forbidden(`Your role on this project may not ${action.replace('_', ' ')} a pay application.`);
  const to = nextStatus(app.status, action);
  if (!to)
    throw new AppError(
      409,
      'PAY_APP_WRONG_STATUS',
      `Pay application ${app.number} is ${label(app.status)}; it cannot be ${DONE[action]} now.`,
    );
  if (expectedRevision !== undefined && expectedRevision !== app.revision) throw stale(app, expectedRevision);
  return to;
}

const stale = (app: PayAppRow, seen: number) =>
  new AppError(
    409,
    'PAY_APP_STALE',
    `Pay application ${app.number} changed since you loaded it (you saw revision ${seen}, it is now revision ${app.revision}, ${label(app.status)}). Reload and try again.`,
  );

/**
 * Moves an application with a conditional update on the status and revision it was read at; 0 rows means
 * someone else moved it first: 409 with what it is now. Writes the status history rows (one per step).
 */
export async function moveStatus(
  tx: Executor,
  app: PayAppRow,
  steps: { from: PayAppStatus; to: PayAppStatus }[],
  actorUserId: string,
  set: Partial<typeof payApps.$inferInsert> = {},
  note = '',
): Promise<PayAppRow> {
  const to = steps.at(-1)?.to ?? app.status;
  const [row] = await tx
    .update(payApps)
    .set({ ...set, status: to })
    .where(and(eq(payApps.id, app.id), eq(payApps.status, app.status), eq(payApps.revision, app.revision)))
    .returning();
  if (!row) {
    const now = await findPayApp(tx, app.id);
    if (now && now.revision !== app.revision) throw stale(now, app.revision);
    throw new AppError(
      409,
      'PAY_APP_WRONG_STATUS',
      `Pay application ${app.number} was moved to ${label(now?.status ?? 'another status')} by someone else meanwhile. Reload to see it.`,
    );
  }
  // Steps of one transaction get distinct times (1 ms apart) so the history reads in order.
  const at = Date.now();
  for (const [i, s] of steps.entries()) {
    await tx.insert(payAppStatusHistory).values({
      payAppId: app.id,
      fromStatus: s.from,
      toStatus: s.to,
      revision: row.revision,
      note,
      actorUserId,
      createdAt: new Date(at + i),
    });
  }
  return row;
}
