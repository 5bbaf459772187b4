import { formatPercent, formatQuantity } from '../../../src/shared/format';
import type { ChangeOrderView } from '../../../src/shared/schemas/change-order';
import type { ForecastInput, VarianceRowView } from '../../../src/shared/schemas/variance';
import type { Db } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { AppError, conflict, notFound } from '../../lib/app-error';
import { recordAudit } from '../audit/audit.repository';
import { findBidItem } from '../bid-items/bid-items.repository';
import { canProposeChangeOrder } from '../../../src/shared/policies/change-orders';
import { proposeChangeOrder, type ChangeOrderContext } from '../change-orders/change-orders.service';
import { isUuid, loadProjectAccess } from '../projects/project-access';
import * as repo from './variance.repository';
import { watchRows } from './variance.service';

/** Either contractor keeps the forecasts; both propose change orders. */
const canForecast = canProposeChangeOrder;

async function loadItem(db: Db, actor: Actor, bidItemId: string) {
  const item = isUuid(bidItemId) ? await findBidItem(db, bidItemId) : undefined;
  if (!item) throw notFound('The bid item');
  const access = await loadProjectAccess(db, actor, item.projectId, canForecast).catch((err: unknown) => {
    throw err instanceof AppError && err.status === 404 ? notFound('The bid item') : err;
  });
  return { item, ...access };
}

/** Sets the forecast at completion of one bid item (latest wins; the trail keeps each change). */
export async function setForecast(
  db: Db,
  actor: Actor,
  bidItemId: string,
  input: ForecastInput,
): Promise<VarianceRowView> {
  const { item, project } = await loadItem(db, actor, bidItemId);
  return db.transaction(async (tx) => {
    const before = await repo.findForecast(tx, bidItemId);
    const after = await repo.upsertForecast(tx, {
      bidItemId,
      projectId: project.id,
      forecastQuantity: input.forecastQuantity,
      note: input.note,
      updatedByUserId: actor.userId,
    });
    await recordAudit(tx, {
      projectId: project.id,
      actorUserId: actor.userId,
      objectType: 'forecast',
      objectId: bidItemId,
      action: 'forecast.updated',
      before: before
        ? { itemNumber: item.itemNumber, forecastQuantity: before.forecastQuantity, note: before.note }
        : null,
      after: { itemNumber: item.itemNumber, forecastQuantity: after.forecastQuantity, note: after.note },
    });
    return (await watchRows(tx, project)).rows.find((r) => r.bidItemId === bidItemId)!;
  });
}

/**
 * One click from the watch: a proposed change order for the quantity beyond the band (plus when over, minus
 * when under). 409 when the item is within its band or a quantity change order for it is still open.
 */
export async function draftVarianceChangeOrder(
  ctx: ChangeOrderContext,
  actor: Actor,
  bidItemId: string,
): Promise<ChangeOrderView> {
  const { db } = ctx;
  const { item, project } = await loadItem(db, actor, bidItemId);
  const row = (await watchRows(db, project)).rows.find((r) => r.bidItemId === bidItemId)!;
  if (row.status !== 'over' && row.status !== 'under') {
    throw conflict('WITHIN_BAND', `Item ${item.itemNumber} is within its variation band; there is nothing to change.`);
  }
  if (row.openChangeOrder) {
    throw conflict(
      'CHANGE_ORDER_OPEN',
      `Change order ${row.openChangeOrder.number} already changes item ${item.itemNumber}'s quantity.`,
    );
  }
  const delta = row.status === 'over' ? row.quantityBeyondBand : -row.quantityBeyondBand;
  const edge = row.status === 'over' ? `above ${row.band!.upper}` : `below ${row.band!.lower}`;
  return proposeChangeOrder(
    ctx,
    actor,
    project.id,
    {
      title: `Item ${item.itemNumber}: quantity beyond the variation band`,
      reason: `Forecast at completion ${formatQuantity(row.forecastAtCompletion, item.payUnit)} against a contract quantity of ${formatQuantity(row.currentContractQuantity, item.payUnit)} (${row.variancePercent === null ? 'no contract quantity' : formatPercent(row.variancePercent, 1)}); ${formatQuantity(row.quantityBeyondBand, item.payUnit)} ${edge}. Drafted from the quantity watch; the unit price of that quantity may be renegotiated under the contract's variation clause.`,
      items: [{ kind: 'change_quantity', bidItemId, quantityDelta: delta }],
    },
    'change_order.drafted_from_watch',
  );
}
