import { FROZEN_STATUSES } from '../../../src/shared/domain/pay-app-status';
import { allowanceDrawnQuantity } from '../../../src/shared/domain/provisions/force-account-pay';
import { addDecimals } from '../../../src/shared/domain/rounding';
import { VARIANCE_BANDS, EARLY_WARNING_SHARE, isMajorItem } from '../../../src/shared/domain/variance';
import type { VarianceRowView, VarianceView } from '../../../src/shared/schemas/variance';
import type { Db, Executor } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { listBidItems } from '../bid-items/bid-items.repository';
import { loadContract, quantitiesOf } from '../change-orders/contract-quantities.repository';
import { loadProjectAccess } from '../projects/project-access';
import type { ProjectRow } from '../projects/projects.repository';
import * as repo from './variance.repository';
import { watchRow } from './variance-row';

/** Claimed but not certified: submitted, in review, or returned to the subcontractor with a dispute. */
const PENDING_STATUSES = ['submitted', 'in_review', 'returned'] as const;

export function clauseName(project: ProjectRow): string {
  return project.variationPreset === 'custom'
    ? 'the contract’s own band'
    : VARIANCE_BANDS[project.variationPreset].source;
}

/** Every bid item of a project against its variation band. */
export async function watchRows(
  db: Executor,
  project: ProjectRow,
): Promise<{ rows: VarianceRowView[]; originalContractAmountCents: number }> {
  const [items, contract, approved, pending, forecasts, open, drawnApproved, drawnPending] = await Promise.all([
    listBidItems(db, project.id),
    loadContract(db, project.id),
    repo.quantitiesByStatus(db, project.id, FROZEN_STATUSES),
    repo.quantitiesByStatus(db, project.id, PENDING_STATUSES),
    repo.listForecasts(db, project.id),
    repo.openQuantityChangeOrders(db, project.id),
    repo.allowanceDrawsByStatus(db, project.id, FROZEN_STATUSES),
    repo.allowanceDrawsByStatus(db, project.id, PENDING_STATUSES),
  ]);
  const quantities = quantitiesOf(contract);
  const originalAmount = (id: string) => contract.byId.get(id)?.originalAmountCents ?? 0;
  const originalContractAmountCents = contract.originalContractSumCents;
  const clause = {
    preset: project.variationPreset,
    custom: { overPercent: project.bandOverBps / 100, underPercent: project.bandUnderBps / 100 },
  };
  const rows = items.map((item) => {
    const forecast = forecasts.find((f) => f.bidItemId === item.id);
    // Priced at the current unit price (original, or the last approved price change). An allowance item is drawn
    // by the force account days under its change order, counted at that price (its own lines bill no quantity).
    const unitPriceCents = contract.byId.get(item.id)!.unitPriceCents;
    const drawn = (by: ReadonlyMap<string, number>) => allowanceDrawnQuantity(by.get(item.id) ?? 0, unitPriceCents);
    const row = watchRow(clause, {
      item: { ...item, unitPriceCents },
      quantity: quantities.get(item.id)!,
      isMajor:
        item.isMajor ||
        isMajorItem(originalAmount(item.id), originalContractAmountCents, project.majorItemThresholdBps / 100),
      approvedToDate: addDecimals(approved.get(item.id) ?? 0, drawn(drawnApproved)),
      pending: addDecimals(pending.get(item.id) ?? 0, drawn(drawnPending)),
      forecast: forecast
        ? {
            quantity: forecast.quantity,
            note: forecast.note,
            updatedAt: forecast.updatedAt.toISOString(),
            updatedBy: forecast.updatedBy,
          }
        : null,
      openChangeOrder: open.get(item.id) ?? null,
    });
    return drawnApproved.has(item.id) || drawnPending.has(item.id) ? { ...row, drawnByForceAccount: true } : row;
  });
  return { rows, originalContractAmountCents };
}

export async function projectVariance(db: Db, actor: Actor, projectId: string): Promise<VarianceView> {
  const { project } = await loadProjectAccess(db, actor, projectId);
  const [{ rows, originalContractAmountCents }, periods] = await Promise.all([
    watchRows(db, project),
    repo.earnedPeriods(db, projectId),
  ]);
  return {
    preset: project.variationPreset,
    clause: clauseName(project),
    earlyWarningPercent: EARLY_WARNING_SHARE * 100,
    originalContractAmountCents,
    rows,
    periods,
  };
}
