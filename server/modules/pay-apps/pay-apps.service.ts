import type { AccessRole } from '../../../src/shared/constants';
import { lineAmountCents, sumCents } from '../../../src/shared/domain/money';
import { changeOrderSummary } from '../../../src/shared/domain/change-order-summary';
import { payAppFlags } from '../../../src/shared/domain/pay-app-flags';
import { payAppPackage } from '../../../src/shared/domain/pay-app-package';
import type { CreatePayAppInput, PayAppDetail } from '../../../src/shared/schemas/pay-app';
import type { AppContext } from '../../app-context';
import type { Db } from '../../db/client';
import { serializeJson } from '../../lib/read-cache';
import type { Actor } from '../../lib/actor';
import { loadProjectAccess } from '../projects/project-access';
import { createPayAppFromTallies } from './pay-app-build';
import { loadPayAppReadAccess } from './pay-app-access';
import { canCreatePayApp, canSeePayApp, payAppCan } from '../../../src/shared/policies/pay-apps';
import {
  presentDispute,
  presentForceAccountLine,
  presentHistory,
  presentHolds,
  presentLine,
  presentSummary,
  presentTally,
} from './pay-apps.presenter';
import { allowanceItems, forceAccountLines, ticketCountsByItem } from './pay-app-records.repository';
import type { PackageForceAccountInput } from '../../../src/shared/domain/pay-app-package';
import type { TicketHold } from '../../../src/shared/domain/provisions/ticket-pay';
import * as repo from './pay-apps.repository';
import { loadContract } from '../change-orders/contract-quantities.repository';
import { adjustmentsThrough, approvedChangeOrders, compiledAt } from './pay-app-provisions.repository';

export async function listPayApps(db: Db, actor: Actor, projectId: string) {
  const { roles } = await loadProjectAccess(db, actor, projectId);
  return (await repo.listPayApps(db, projectId))
    .filter((a) => canSeePayApp(roles, a.status))
    .map((a) => presentSummary(a));
}

/** One application with its lines, history, disputes with their threads, and the tallies it bills (one read). */
export async function payAppDetail(db: Db, payAppId: string, roles: AccessRole[]): Promise<PayAppDetail> {
  const app = (await repo.findPayAppDetail(db, payAppId))!;
  const lines = app.lines.map(presentLine);
  const forceAccount = (await forceAccountLines(db, payAppId)).map(presentForceAccountLine);
  // Force account is valued as done: its scheduled value is its amount to date (pay-app-package.ts).
  const contractSumCents = sumCents([
    ...lines.map((l) => lineAmountCents(l.contractQuantity, l.unitPriceCents)),
    ...forceAccount.map((f) => f.amountToDateCents),
  ]);
  const percentCompleteBps = contractSumCents > 0 ? Math.floor((app.earnedToDateCents * 10_000) / contractSumCents) : 0;
  const [bandOverBps, withEvidence] = await Promise.all([
    repo.projectBandOverBps(db, app.projectId),
    repo.talliesWithEvidence(
      db,
      app.tallies.map((t) => t.id),
    ),
  ]);
  // A line paid from tickets has them as its backup (each ticket is the record of its load), not tallies.
  const tickets = await ticketCountsByItem(db, payAppId);
  const evidence = new Map(
    lines.map((l) => {
      const mine = app.tallies.filter((t) => t.bidItemId === l.bidItemId);
      const loads = tickets.get(l.bidItemId) ?? 0;
      return [
        l.id,
        { tallies: mine.length + loads, withoutEvidence: mine.filter((t) => !withEvidence.has(t.id)).length },
      ];
    }),
  );
  const allowance = await allowanceItems(
    db,
    forceAccount.map((f) => f.changeOrderId),
  );
  const numberOf = new Map(lines.map((l) => [l.bidItemId, l.itemNumber]));
  const pkg = await packageOf(
    db,
    app,
    lines,
    forceAccount.map((f) => {
      const item = allowance.get(f.changeOrderId);
      return { ...f, allowanceItemNumber: item ? (numberOf.get(item) ?? null) : null };
    }),
  );
  const itemNumber = new Map(lines.map((l) => [l.bidItemId, l.itemNumber]));
  return {
    ...presentSummary(app, app.certifiedBy?.name ?? null),
    lines,
    history: app.history.map(presentHistory),
    disputes: app.disputes.map(presentDispute),
    tallies: app.tallies.map(presentTally),
    contractSumCents,
    flags: payAppFlags(lines, bandOverBps, evidence),
    percentCompleteBps,
    can: payAppCan(roles, app.status),
    forceAccount,
    ticketHolds: presentHolds(app.ticketHolds as TicketHold[], itemNumber),
    ...pkg,
  };
}

/**
 * The package figures (payAppPackage, pure) from the stored lines, with the change orders approved up to the
 * application's compilation (the contract its lines were priced on) and the deductions it counted.
 */
async function packageOf(
  db: Db,
  app: NonNullable<Awaited<ReturnType<typeof repo.findPayAppDetail>>>,
  lines: ReturnType<typeof presentLine>[],
  forceAccount: PackageForceAccountInput[],
) {
  const [contract, previousCutOff, adjustments] = await Promise.all([
    loadContract(db, app.projectId),
    compiledAt(db, app.projectId, app.number - 1),
    adjustmentsThrough(db, app.projectId, app.periodEnd),
  ]);
  const approved = await approvedChangeOrders(db, app.projectId, contract.inputs.changes);
  const counted = adjustments.filter((a) => a.createdAt <= app.createdAt);
  return {
    package: payAppPackage({
      lines,
      forceAccount,
      originalContractCents: contract.originalContractSumCents,
      changeOrders: changeOrderSummary(
        contract.inputs.items,
        approved,
        app.createdAt.toISOString(),
        previousCutOff?.toISOString() ?? null,
      ),
      retainageBps: app.retainageBps,
      adjustmentsCents: app.adjustmentsCents,
      previousCertifiedCents: app.previousCertifiedCents,
    }),
    adjustments: counted.map(({ createdAt: _c, ...a }) => a),
  };
}

/**
 * The answer to GET of one application, serialized once per read version and viewer: access is checked on every
 * request (the same statement reads the version), and only the detail's reads and pricing are skipped while no
 * write has committed since (read_version). The viewer's roles are part of the key: the answer carries `can`.
 */
export async function getPayAppAnswer(ctx: Pick<AppContext, 'db' | 'payAppReads'>, actor: Actor, payAppId: string) {
  const { roles, readVersion } = await loadPayAppReadAccess(ctx.db, actor, payAppId);
  return payAppAnswer(ctx, actor, payAppId, roles, readVersion);
}

/** The answer for a reader whose access was checked just now, with the read version read in the same statement. */
export function payAppAnswer(
  ctx: Pick<AppContext, 'db' | 'payAppReads'>,
  actor: Actor,
  payAppId: string,
  roles: AccessRole[],
  readVersion: string | null,
) {
  const rolesKey = [...roles].sort().join(',');
  return ctx.payAppReads.answer(payAppId, actor.userId, readVersion, rolesKey, async () =>
    serializeJson({ payApp: await payAppDetail(ctx.db, payAppId, roles) }),
  );
}

export async function createPayApp(db: Db, actor: Actor, projectId: string, input: CreatePayAppInput) {
  const { project, roles } = await loadProjectAccess(db, actor, projectId, canCreatePayApp);
  const app = await db.transaction((tx) => createPayAppFromTallies(tx, { project, userId: actor.userId, ...input }));
  return payAppDetail(db, app.id, roles);
}
