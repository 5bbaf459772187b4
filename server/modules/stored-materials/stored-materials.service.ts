import { storedAccount } from '../../../src/shared/domain/provisions/stored-materials';
import type {
  AddStoredMovementInput,
  CreateStoredMaterialInput,
} from '../../../src/shared/schemas/provisions/accounts';
import type { Db } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { AppError, notFound } from '../../lib/app-error';
import { isDomainError } from '../../../src/shared/domain/domain-error';
import { isUuid, loadProjectAccess } from '../projects/project-access';
import { canKeepFieldRecords } from '../../../src/shared/policies/field-records';
import { projectBidItem, recordChange } from '../field-records/record-change';
import { presentMaterial } from './stored-materials.presenter';
import * as repo from './stored-materials.repository';

export async function listMaterials(db: Db, actor: Actor, projectId: string, from?: string, to?: string) {
  await loadProjectAccess(db, actor, projectId);
  const rows = await repo.listMaterials(db, projectId);
  const moves = await repo.movementsOf(
    db,
    rows.map((r) => r.id),
  );
  return rows.map((r) => presentMaterial(r, moves, from, to));
}

export async function addMaterial(db: Db, actor: Actor, projectId: string, input: CreateStoredMaterialInput) {
  return recordChange(
    db,
    actor,
    projectId,
    canKeepFieldRecords,
    { objectType: 'stored_material', action: 'stored_material.added' },
    async (tx) => {
      await projectBidItem(tx, projectId, input.bidItemId);
      const row = await repo.insertMaterial(tx, { ...input, projectId });
      return { id: row.id, after: input, value: presentMaterial(row, []) };
    },
  );
}

/** An addition on a paid invoice, or a use (built in). Using more than is on hand is refused naming the quantity. */
export async function addMovement(db: Db, actor: Actor, materialId: string, input: AddStoredMovementInput) {
  const material = isUuid(materialId) ? await repo.findMaterial(db, materialId) : undefined;
  if (!material) throw notFound('The stored material');
  return recordChange(
    db,
    actor,
    material.projectId,
    canKeepFieldRecords,
    { objectType: 'stored_material', action: `stored_material.${input.kind}`, notFoundAs: 'The stored material' },
    async (tx) => {
      const row = await repo.insertMovement(tx, {
        ...input,
        storedMaterialId: material.id,
        createdByUserId: actor.userId,
      });
      const moves = await repo.movementsOf(tx, [material.id]);
      // The whole account in date order must stay at or above zero on hand (the transaction rolls back if not).
      try {
        storedAccount(
          { unitCostCents: material.unitCostCents, neededQuantity: material.neededQuantity },
          moves.map((m, i) => ({ kind: m.kind, quantity: m.quantity, period: i + 1 })),
          moves.length,
        );
      } catch (err) {
        if (isDomainError(err)) throw overdrawn();
        throw err;
      }
      return { id: material.id, after: { movementId: row.id, ...input }, value: presentMaterial(material, moves) };
    },
  );
}

const overdrawn = () =>
  new AppError(400, 'INVALID_QUANTITY', 'More would be used than is stored on that date.', [
    { path: 'quantity', message: 'More than is on hand' },
  ]);
