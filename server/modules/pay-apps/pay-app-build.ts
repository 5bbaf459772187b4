import { and, eq, inArray } from 'drizzle-orm';
import { sumCents } from '../../../src/shared/domain/money';
import { payApplication, type PayAppLineInput, type PayAppResult } from '../../../src/shared/domain/pay-app';
import { currentContract } from '../../../src/shared/domain/contract';
import { mobilizationLine, type MobilizationStep } from '../../../src/shared/domain/provisions/mobilization';
import { addDecimals, roundTo } from '../../../src/shared/domain/rounding';
import type { Executor } from '../../db/client';
import { payAppForceAccountLines, payAppLines, payApps, payAppStatusHistory, tallies } from '../../db/schema';
import { newPayAppBlocker } from '../../../src/shared/domain/pay-app-status';
import { AppError } from '../../lib/app-error';
import { recordAudit } from '../audit/audit.repository';
import { loadContract } from '../change-orders/contract-quantities.repository';
import type { ProjectRow } from '../projects/projects.repository';
import * as repo from './pay-apps.repository';
import {
  adjustmentsThrough,
  mobilizationStepsByItem,
  profilesByItem,
  storedMaterialsByItem,
} from './pay-app-provisions.repository';
import { precisionFor } from '../../../src/shared/domain/provisions/precision';
import { settingsQuantityToDate } from '../../../src/shared/domain/provisions/settings-quantity';
import { paySourceOf, type PaySourceSettings } from '../../../src/shared/domain/provisions/tally-pay';
import type { MeasurementProfile, PayLineSource, PayUnit } from '../../../src/shared/constants';
import { forceAccountAsPayLine } from '../../../src/shared/domain/provisions/force-account-pay';
import { forceAccountForPeriod, markPaid, ticketQuantities } from './pay-app-records';
import { allowanceItems, forceAccountLines } from './pay-app-records.repository';

export type CreatePayAppArgs = {
  project: ProjectRow;
  userId: string;
  periodStart: string;
  periodEnd: string;
  isFinal?: boolean;
};

/** "Less previous certified" and each bid item's line on the latest certified application. */
async function previousOf(tx: Executor, projectId: string, number: number) {
  const last = await repo.latestFrozen(tx, projectId);
  const lines = last ? await repo.listLines(tx, last.id) : [];
  return {
    id: last?.id,
    byItem: new Map(lines.map((l) => [l.bidItemId, l])),
    certified: await repo.previousCertifiedCents(tx, projectId, number),
  };
}

/**
 * Creates the project's next numbered pay application from its ready tallies measured within the period, inside
 * the caller's transaction: one line per bid item, the tallies marked billed and linked, a status history row
 * and the audit event. The route calls it, and so can the demo seeder. Returns the new application.
 */
export async function createPayAppFromTallies(tx: Executor, args: CreatePayAppArgs) {
  const { project, userId, periodStart, periodEnd } = args;
  const blocker = newPayAppBlocker(await repo.openPayApps(tx, project.id));
  if (blocker) throw new AppError(409, 'PAY_APP_OPEN', blocker);
  const last = await repo.lastNumberAndPeriod(tx, project.id);
  if (last.periodEnd && periodStart <= last.periodEnd) {
    throw new AppError(
      409,
      'PERIOD_OVERLAP',
      `The period must start after ${last.periodEnd}, the end of the previous pay application.`,
      [{ path: 'periodStart', message: `Start after ${last.periodEnd}` }],
    );
  }
  const number = last.number + 1;
  const items = await repo.projectBidItems(tx, project.id);
  const contract = await loadContract(tx, project.id);
  const steps = await mobilizationStepsByItem(tx, project.id);
  // A lump sum paid by percent or stages and a plan quantity paid by percent complete take their quantity to date
  // from the item's settings (mobilization steps come first, below).
  const profiles = await profilesByItem(tx, project.id);
  const bySettings = new Map<string, number>();
  for (const item of items) {
    const p = profiles.get(item.id);
    if (!p || steps.has(item.id)) continue;
    const decimals = precisionFor(item.payUnit as PayUnit, p.payDecimals).measuredDecimals;
    const quantity = settingsQuantityToDate(
      p.profile,
      p.settings,
      contract.byId.get(item.id)!.contractQuantity,
      decimals,
      periodEnd,
    );
    if (quantity !== null) bySettings.set(item.id, quantity);
  }
  // Truck-measure and weight items are paid from their tickets (held ones left out, with their reason).
  const tickets = await ticketQuantities(tx, project.id, periodEnd, items, profiles);
  // Those items' tallies stay ready, unbilled: the settings, the steps or the tickets decide what they are paid
  // (one rule, `paySourceOf`, which the bid schedule and the tally screens also show).
  const paidFrom = new Map(items.map((item) => [item.id, sourceOf(profiles.get(item.id))]));
  const billed = (await repo.readyTallies(tx, project.id, periodStart, periodEnd)).filter(
    (t) => paidFrom.get(t.bidItemId) === 'tallies',
  );
  const stored = await storedMaterialsByItem(tx, project.id, periodEnd);
  const adjustmentsCents = sumCents((await adjustmentsThrough(tx, project.id, periodEnd)).map((a) => a.amountCents));
  const thisPeriod = new Map<string, number>();
  for (const t of billed) thisPeriod.set(t.bidItemId, addDecimals(thisPeriod.get(t.bidItemId) ?? 0, t.quantity));
  for (const [itemId, quantity] of tickets.byItem) thisPeriod.set(itemId, quantity);
  const prev = await previousOf(tx, project.id, number);
  const forceAccount = await forceAccountForPeriod(tx, project.id, periodEnd, prev.id);
  const allowance = await allowanceItems(
    tx,
    forceAccount.map((l) => l.changeOrderId),
  );
  // Each line takes the contract as it stands now (current quantity and price, shared contract function); the
  // previous amount is the one certified, so a price change applies only to quantities paid after it.
  const bases: PayAppLineInput[] = items.map((item) => {
    const current = contract.byId.get(item.id)!;
    const previous = prev.byItem.get(item.id);
    const settled = bySettings.get(item.id);
    return {
      unitPriceCents: current.unitPriceCents,
      contractQuantity: current.contractQuantity,
      previousQuantity: previous?.toDateQuantity ?? 0,
      thisPeriodQuantity:
        settled === undefined ? (thisPeriod.get(item.id) ?? 0) : roundTo(settled - (previous?.toDateQuantity ?? 0), 4),
      previousAmountCents: previous?.amountToDateCents,
      storedMaterialsCents: stored.get(item.id) ?? 0,
    };
  });
  const mobilization = {
    steps: items.map((item) => steps.get(item.id)),
    originalContractCents: originalSum(contract),
  };
  // Force account lines come after the bid items, each priced from its signed days (never an item's quantity).
  const computed = compute(
    [...bases, ...forceAccount.map((l) => forceAccountAsPayLine(l, allowance.has(l.changeOrderId)))],
    project,
    prev.certified,
    adjustmentsCents,
    mobilization,
  );
  const [app] = await tx
    .insert(payApps)
    .values({
      projectId: project.id,
      number,
      periodStart,
      periodEnd,
      isFinal: args.isFinal ?? false,
      ticketHolds: tickets.holds,
      createdByUserId: userId,
      ...totalsOf(computed),
    })
    .returning();
  if (items.length > 0) {
    await tx.insert(payAppLines).values(
      items.map((item, i) => ({
        payAppId: app!.id,
        bidItemId: item.id,
        sortOrder: i,
        itemNumber: item.itemNumber,
        description: item.description,
        payUnit: item.payUnit,
        unitPriceCents: bases[i]!.unitPriceCents,
        contractQuantity: bases[i]!.contractQuantity,
        previousQuantity: bases[i]!.previousQuantity,
        thisPeriodQuantity: bases[i]!.thisPeriodQuantity,
        paidFrom: paidFrom.get(item.id)!,
        ...lineColumns(computed.lines[i]!),
      })),
    );
  }
  if (forceAccount.length > 0) {
    await tx.insert(payAppForceAccountLines).values(
      forceAccount.map((l, j) => ({
        payAppId: app!.id,
        changeOrderId: l.changeOrderId,
        sortOrder: j,
        changeOrderNumber: l.number,
        title: l.title,
        days: l.days,
        ...forceAccountColumns(computed.lines[items.length + j]!),
      })),
    );
  }
  const sheetIds = forceAccount.flatMap((l) => l.sheetIds);
  await markPaid(tx, app!.id, tickets, sheetIds);
  if (billed.length > 0) {
    const ids = billed.map((t) => t.id);
    const marked = await tx
      .update(tallies)
      .set({ status: 'billed', payAppId: app!.id })
      .where(and(inArray(tallies.id, ids), eq(tallies.status, 'ready')))
      .returning({ id: tallies.id });
    if (marked.length !== ids.length)
      throw new AppError(
        409,
        'TALLY_CHANGED',
        'A tally of the period changed while the pay application was compiled; try again.',
      );
  }
  await tx.insert(payAppStatusHistory).values({
    payAppId: app!.id,
    fromStatus: null,
    toStatus: 'draft',
    revision: 0,
    note: compiledNote(billed.length, tickets.truckIds.length + tickets.scaleIds.length, sheetIds.length),
    actorUserId: userId,
    createdAt: new Date(),
  });
  await recordAudit(tx, {
    projectId: project.id,
    actorUserId: userId,
    objectType: 'pay_app',
    objectId: app!.id,
    action: 'pay_app.created',
    after: {
      number,
      periodStart,
      periodEnd,
      tallyIds: billed.map((t) => t.id),
      truckTicketIds: tickets.truckIds,
      scaleTicketIds: tickets.scaleIds,
      ticketsHeld: tickets.holds.length,
      dailySheetIds: sheetIds,
      ...totalsOf(computed),
    },
  });
  return app!;
}

/**
 * The engine's pay application arithmetic (src/shared/domain/pay-app.ts) with the project's retainage terms:
 * rates in basis points become percents; the reduced rate applies once earned to date reaches the reduction point.
 */
function compute(
  lines: PayAppLineInput[],
  project: ProjectRow,
  previousCertified: number[],
  adjustmentsToDateCents: number,
  mobilization: Mobilization,
) {
  const reduction =
    project.retainageReducedBps !== null && project.retainageReductionAtBps !== null
      ? {
          afterPercentComplete: project.retainageReductionAtBps / 100,
          reducedPercent: project.retainageReducedBps / 100,
        }
      : undefined;
  const previousCertifiedCents = sumCents(previousCertified);
  const run = () =>
    payApplication({
      retainagePercent: project.retainageBps / 100,
      previousCertifiedCents,
      lines,
      adjustmentsToDateCents,
      retainageReduction: reduction,
    });
  let result = run();
  if (mobilization.steps.some(Boolean)) {
    // Mobilization in steps of the original contract earned, counting every other line's work to date (first
    // pass), then priced with the rest (second pass). The line's quantity is written back into `lines`.
    // Only bid items count (`steps` has one entry per item): force account lines after them are not contract work.
    const others = sumCents(
      result.lines
        .filter((_, i) => i < mobilization.steps.length && !mobilization.steps[i])
        .map((l) => l.amountToDateCents),
    );
    lines.forEach((line, i) => {
      const steps = mobilization.steps[i];
      if (!steps) return;
      line.thisPeriodQuantity = mobilizationLine({
        contractQuantity: line.contractQuantity,
        mobilizationCents: result.lines[i]!.contractAmountCents,
        previousQuantity: line.previousQuantity,
        originalContractCents: mobilization.originalContractCents,
        otherEarnedToDateCents: others,
        steps,
      }).thisPeriodQuantity;
    });
    result = run();
  }
  return { ...result, previousCertifiedCents };
}

/** Each line's mobilization steps (undefined: not paid in steps) and the original contract sum they measure. */
type Mobilization = { steps: (MobilizationStep[] | undefined)[]; originalContractCents: number };

/** The contract sum before any change order (original quantities x original prices). */
function originalSum(contract: Awaited<ReturnType<typeof loadContract>>): number {
  return currentContract(contract.inputs.items, []).contractSumCents;
}

const forceAccountColumns = (l: PayAppResult['lines'][number]) => ({
  previousAmountCents: l.previousAmountCents,
  thisPeriodAmountCents: l.thisPeriodAmountCents,
  amountToDateCents: l.amountToDateCents,
  retainageCents: l.retainageCents,
});

const lineColumns = (l: PayAppResult['lines'][number]) => ({
  toDateQuantity: l.toDateQuantity,
  previousAmountCents: l.previousAmountCents,
  amountToDateCents: l.amountToDateCents,
  thisPeriodAmountCents: l.thisPeriodAmountCents,
  retainageCents: l.retainageCents,
  storedMaterialsCents: l.storedMaterialsCents,
});

export function totalsOf(c: PayAppResult & { previousCertifiedCents: number }) {
  return {
    retainageBps: Math.round(c.retainagePercentApplied * 100),
    earnedToDateCents: c.earnedToDateCents,
    thisPeriodCents: c.thisPeriodCents,
    retainageCents: c.retainageCents,
    previousCertifiedCents: c.previousCertifiedCents,
    adjustmentsCents: c.adjustmentsCents,
    currentDueCents: c.currentDueCents,
  };
}

/** Recomputes every line of an application from its quantities (after a revision took counter quantities). */
export async function recomputeLines(
  tx: Executor,
  project: ProjectRow,
  app: { id: string; number: number; adjustmentsCents: number },
  quantities: Map<string, number>,
) {
  const lines = await repo.listLines(tx, app.id);
  const prev = await previousOf(tx, project.id, app.number);
  const steps = await mobilizationStepsByItem(tx, project.id);
  const contract = await loadContract(tx, project.id);
  const bases: PayAppLineInput[] = lines.map((l) => ({
    unitPriceCents: l.unitPriceCents,
    contractQuantity: l.contractQuantity,
    previousQuantity: l.previousQuantity,
    thisPeriodQuantity: quantities.get(l.id) ?? l.thisPeriodQuantity,
    previousAmountCents: l.previousAmountCents,
    storedMaterialsCents: l.storedMaterialsCents,
  }));
  // Materials stored and adjustments stay as compiled for the period; mobilization follows the revised lines.
  const mobilization = {
    steps: lines.map((l) => steps.get(l.bidItemId)),
    originalContractCents: originalSum(contract),
  };
  const forceAccount = await forceAccountLines(tx, app.id);
  const allowance = await allowanceItems(
    tx,
    forceAccount.map((l) => l.changeOrderId),
  );
  const faBases = forceAccount.map((l) =>
    forceAccountAsPayLine(
      { previousCents: l.previousAmountCents, thisPeriodCents: l.thisPeriodAmountCents },
      allowance.has(l.changeOrderId),
    ),
  );
  const computed = compute([...bases, ...faBases], project, prev.certified, app.adjustmentsCents, mobilization);
  for (const [j, l] of forceAccount.entries()) {
    await tx
      .update(payAppForceAccountLines)
      .set(forceAccountColumns(computed.lines[lines.length + j]!))
      .where(eq(payAppForceAccountLines.id, l.id));
  }
  for (const [i, l] of lines.entries()) {
    await tx
      .update(payAppLines)
      .set({ thisPeriodQuantity: bases[i]!.thisPeriodQuantity, ...lineColumns(computed.lines[i]!) })
      .where(eq(payAppLines.id, l.id));
  }
  return totalsOf(computed);
}

/** "Compiled from 3 tallies, 17 tickets and 1 force account day" (the parts that are there). */
function compiledNote(tallyCount: number, ticketCount: number, dayCount: number): string {
  const n = (c: number, one: string, many: string) => `${c} ${c === 1 ? one : many}`;
  const parts = [n(tallyCount, 'tally', 'tallies')];
  if (ticketCount > 0) parts.push(n(ticketCount, 'ticket', 'tickets'));
  if (dayCount > 0) parts.push(n(dayCount, 'force account day', 'force account days'));
  return `Compiled from ${parts.length > 1 ? `${parts.slice(0, -1).join(', ')} and ${parts.at(-1)}` : parts[0]}`;
}

/** What an item's line is paid from, by its measurement profile (none: its tallies). */
function sourceOf(profile: { profile: MeasurementProfile; settings: PaySourceSettings } | undefined): PayLineSource {
  return profile ? paySourceOf(profile.profile, profile.settings) : 'tallies';
}
