import { and, asc, eq, lte } from 'drizzle-orm';
import type { ApprovedChangeOrderInput } from '../../../src/shared/domain/change-order-summary';
import type { ContractChangeInput } from '../../../src/shared/domain/contract';
import { sumCents, type Cents } from '../../../src/shared/domain/money';
import type { MobilizationStep } from '../../../src/shared/domain/provisions/mobilization';
import { storedAccount } from '../../../src/shared/domain/provisions/stored-materials';
import type { ProfileSettings } from '../../../src/shared/schemas/provisions/profile';
import type { Executor } from '../../db/client';
import { bidItemProfiles, changeOrders, payAdjustments, payApps } from '../../db/schema';
import { listMaterials, movementsOf } from '../stored-materials/stored-materials.repository';

/**
 * Each bid item's materials stored at the end of `periodEnd` (payable value: what is on hand and still needed, at
 * invoice cost), from the running accounts; movements dated after the period's end do not count yet.
 */
export async function storedMaterialsByItem(
  tx: Executor,
  projectId: string,
  periodEnd: string,
): Promise<Map<string, Cents>> {
  const materials = await listMaterials(tx, projectId);
  const movements = materials.length
    ? await movementsOf(
        tx,
        materials.map((m) => m.id),
      )
    : [];
  const byItem = new Map<string, Cents>();
  for (const m of materials) {
    const mine = movements
      .filter((v) => v.storedMaterialId === m.id)
      .sort((a, b) => a.movedOn.localeCompare(b.movedOn))
      .map((v) => ({ kind: v.kind, quantity: v.quantity, period: v.movedOn <= periodEnd ? 1 : 2 }));
    const account = storedAccount({ unitCostCents: m.unitCostCents, neededQuantity: m.neededQuantity }, mine, 1);
    byItem.set(m.bidItemId, sumCents([byItem.get(m.bidItemId) ?? 0, account.payableCents]));
  }
  return byItem;
}

/** Deductions and adjustments dated up to the period's end, oldest first. */
export function adjustmentsThrough(tx: Executor, projectId: string, periodEnd: string) {
  return tx
    .select({
      id: payAdjustments.id,
      kind: payAdjustments.kind,
      appliesOn: payAdjustments.appliesOn,
      description: payAdjustments.description,
      amountCents: payAdjustments.amountCents,
      createdAt: payAdjustments.createdAt,
    })
    .from(payAdjustments)
    .where(and(eq(payAdjustments.projectId, projectId), lte(payAdjustments.appliesOn, periodEnd)))
    .orderBy(asc(payAdjustments.appliesOn), asc(payAdjustments.createdAt));
}

/** Each profiled item's profile, precision and settings, by bid item. */
export async function profilesByItem(tx: Executor, projectId: string) {
  const rows = await tx
    .select({
      bidItemId: bidItemProfiles.bidItemId,
      profile: bidItemProfiles.profile,
      payDecimals: bidItemProfiles.payDecimals,
      settings: bidItemProfiles.settings,
    })
    .from(bidItemProfiles)
    .where(eq(bidItemProfiles.projectId, projectId));
  return new Map(rows.map((r) => [r.bidItemId, { ...r, settings: r.settings as ProfileSettings }]));
}

/** The project's lump-sum items paid in mobilization steps, by bid item. */
export async function mobilizationStepsByItem(
  tx: Executor,
  projectId: string,
): Promise<Map<string, MobilizationStep[]>> {
  const rows = await tx
    .select({ bidItemId: bidItemProfiles.bidItemId, settings: bidItemProfiles.settings })
    .from(bidItemProfiles)
    .where(and(eq(bidItemProfiles.projectId, projectId), eq(bidItemProfiles.profile, 'lump_sum')));
  const steps = new Map<string, MobilizationStep[]>();
  for (const r of rows) {
    const s = (r.settings as ProfileSettings).mobilizationSteps;
    if (s && s.length > 0) steps.set(r.bidItemId, s);
  }
  return steps;
}

/**
 * The approved change orders in the order the contract applies them (decided_at, then number), each with its
 * changes as the contract reader gave them (`loadContract`'s inputs).
 */
export async function approvedChangeOrders(
  tx: Executor,
  projectId: string,
  changes: readonly ContractChangeInput[],
): Promise<ApprovedChangeOrderInput[]> {
  const rows = await tx
    .select({ number: changeOrders.number, title: changeOrders.title, decidedAt: changeOrders.decidedAt })
    .from(changeOrders)
    .where(and(eq(changeOrders.projectId, projectId), eq(changeOrders.status, 'approved')))
    .orderBy(asc(changeOrders.decidedAt), asc(changeOrders.number));
  return rows.map((r) => ({
    number: r.number,
    title: r.title,
    approvedAt: (r.decidedAt ?? new Date(0)).toISOString(),
    changes: changes.filter((c) => c.changeOrderNumber === r.number),
  }));
}

/** When the project's application numbered `number` was compiled (its change order cut-off), or null. */
export async function compiledAt(tx: Executor, projectId: string, number: number): Promise<Date | null> {
  const [row] = await tx
    .select({ createdAt: payApps.createdAt })
    .from(payApps)
    .where(and(eq(payApps.projectId, projectId), eq(payApps.number, number)))
    .limit(1);
  return row?.createdAt ?? null;
}
