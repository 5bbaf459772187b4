import { fuelAdjustment, liquidatedDamagesCents } from '../../../src/shared/domain/provisions/deductions';
import type { CreateAdjustmentInput } from '../../../src/shared/schemas/provisions/accounts';
import type { PayAdjustmentView } from '../../../src/shared/schemas/provisions/views';
import type { Db } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { loadProjectAccess } from '../projects/project-access';
import { canRecordAdjustment } from '../../../src/shared/policies/field-records';
import { asAppError, recordChange } from '../field-records/record-change';
import * as repo from './pay-adjustments.repository';

const present = (r: repo.PayAdjustmentRow): PayAdjustmentView => ({
  id: r.id,
  kind: r.kind,
  appliesOn: r.appliesOn,
  description: r.description,
  amountCents: r.amountCents,
  basis: r.basis as Record<string, unknown>,
});

export async function listAdjustments(db: Db, actor: Actor, projectId: string) {
  await loadProjectAccess(db, actor, projectId);
  return (await repo.listAdjustments(db, projectId)).map(present);
}

/** The amount of an adjustment line, computed on the server from its basis (a deduction is negative). */
function amountOf(input: CreateAdjustmentInput): { amountCents: number; basis: Record<string, unknown> } {
  switch (input.kind) {
    case 'liquidated_damages':
      return {
        amountCents: liquidatedDamagesCents(input.daysOverrun, input.dailyCents),
        basis: { daysOverrun: input.daysOverrun, dailyCents: input.dailyCents, source: '23 CFR 635.127' },
      };
    case 'fuel_adjustment': {
      const { fuelKind, quantityCy, baseIndex, currentIndex, triggerPercent } = input;
      const fuel = fuelAdjustment({ kind: fuelKind, quantityCy, baseIndex, currentIndex, triggerPercent });
      return {
        amountCents: fuel.amountCents,
        basis: { fuelKind, quantityCy, baseIndex, currentIndex, triggerPercent, gallons: fuel.gallons },
      };
    }
    case 'credit':
      return { amountCents: 0 - input.amountCents || 0, basis: {} };
    case 'other':
      return { amountCents: input.amountCents, basis: {} };
  }
}

export async function addAdjustment(db: Db, actor: Actor, projectId: string, input: CreateAdjustmentInput) {
  return recordChange(
    db,
    actor,
    projectId,
    canRecordAdjustment,
    { objectType: 'pay_adjustment', action: 'pay_adjustment.added' },
    async (tx) => {
      const { amountCents, basis } = await asAppError(() => amountOf(input));
      const row = await repo.insertAdjustment(tx, {
        projectId,
        kind: input.kind,
        appliesOn: input.appliesOn,
        description: input.description,
        amountCents,
        basis,
        createdByUserId: actor.userId,
      });
      const view = present(row);
      return { id: row.id, after: view, value: view };
    },
  );
}
