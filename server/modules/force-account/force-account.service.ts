import { dailySheetTotals } from '../../../src/shared/domain/provisions/force-account';
import type { CreateForceAccountSheetInput } from '../../../src/shared/schemas/provisions/accounts';
import type { Db } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { conflict, notFound, validationFailed } from '../../lib/app-error';
import { isUuid, loadProjectAccess } from '../projects/project-access';
import { canKeepFieldRecords, canSignDailySheet, signingSides } from '../../../src/shared/policies/field-records';
import { asAppError, isUniqueViolation, recordChange } from '../field-records/record-change';
import { presentSheet, type DailySheetView } from './force-account.presenter';
import * as repo from './force-account.repository';

export async function listSheets(db: Db, actor: Actor, projectId: string): Promise<DailySheetView[]> {
  await loadProjectAccess(db, actor, projectId);
  return (await repo.listSheets(db, projectId)).map(presentSheet);
}

/** A day of force account work: only under an approved change order of the project, one sheet per day. */
export async function addSheet(db: Db, actor: Actor, projectId: string, input: CreateForceAccountSheetInput) {
  const taken = () =>
    conflict('DAILY_SHEET_EXISTS', `A daily sheet for ${input.workedOn} is already on this change order.`);
  try {
    return await recordChange(
      db,
      actor,
      projectId,
      canKeepFieldRecords,
      { objectType: 'force_account_sheet', action: 'force_account_sheet.added' },
      async (tx) => {
        const order = await repo.findProjectChangeOrder(tx, projectId, input.changeOrderId);
        if (!order)
          throw validationFailed([{ path: 'changeOrderId', message: 'No such change order on this project' }]);
        if (order.status !== 'approved') {
          throw conflict(
            'CHANGE_ORDER_NOT_APPROVED',
            `Change order ${order.number} is not approved: force account work needs an approved change order first.`,
          );
        }
        if (await repo.sheetForDay(tx, order.id, input.workedOn)) throw taken();
        const { changeOrderId, workedOn, description, ...lines } = input;
        const totals = await asAppError(() => dailySheetTotals(lines));
        const row = await repo.insertSheet(tx, {
          projectId,
          changeOrderId,
          workedOn,
          description,
          lines,
          totalCents: totals.totalCents,
          createdByUserId: actor.userId,
        });
        const view = presentSheet(row);
        return { id: row.id, after: { changeOrderId, workedOn, totalCents: totals.totalCents }, value: view };
      },
    );
  } catch (err) {
    if (isUniqueViolation(err)) throw taken();
    throw err;
  }
}

/** Signs a sheet for the actor's side (the subcontractor's, the general contractor's); each side signs once. */
export async function signSheet(db: Db, actor: Actor, sheetId: string) {
  const found = isUuid(sheetId) ? await repo.findSheet(db, sheetId) : undefined;
  if (!found) throw notFound('The daily sheet');
  return recordChange(
    db,
    actor,
    found.projectId,
    canSignDailySheet,
    { objectType: 'force_account_sheet', action: 'force_account_sheet.signed', notFoundAs: 'The daily sheet' },
    async (tx, { roles }) => {
      const sheet = (await repo.findSheet(tx, sheetId))!;
      const side = signingSides(roles).find((s) =>
        s === 'contractor' ? !sheet.contractorSignedAt : !sheet.gcSignedAt,
      );
      if (!side) throw conflict('ALREADY_SIGNED', 'Your side has already signed this daily sheet.');
      const now = new Date();
      const row = await repo.updateSheet(
        tx,
        sheet.id,
        side === 'contractor'
          ? { contractorSignedByUserId: actor.userId, contractorSignedAt: now }
          : { gcSignedByUserId: actor.userId, gcSignedAt: now },
      );
      return { id: row.id, after: { side, signedAt: now.toISOString() }, value: presentSheet(row) };
    },
  );
}
