import { conversionFactor, netWeight } from '../../../src/shared/domain/provisions/weight';
import type { CreateMaterialSourceInput, CreateScaleTicketInput } from '../../../src/shared/schemas/provisions/tickets';
import type { PageQuery } from '../../../src/shared/schemas/paging';
import type { Db } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { conflict, validationFailed } from '../../lib/app-error';
import { pageOf } from '../../lib/paging';
import { loadProjectAccess } from '../projects/project-access';
import { canKeepFieldRecords } from '../../../src/shared/policies/field-records';
import { asAppError, isUniqueViolation, itemMeasuredBy, recordChange } from '../field-records/record-change';
import { presentScaleTicket, presentSource } from './scale-tickets.presenter';
import * as repo from './scale-tickets.repository';

export async function listSources(db: Db, actor: Actor, projectId: string) {
  await loadProjectAccess(db, actor, projectId);
  return (await repo.listSources(db, projectId)).map(presentSource);
}

/** A source with its weighed loads; the factor is computed to 4 decimals and used to 3 (RE Manual 109.12). */
export async function addSource(db: Db, actor: Actor, projectId: string, input: CreateMaterialSourceInput) {
  const taken = () => conflict('SOURCE_ALREADY_EXISTS', `A source named ${input.name} is already on the project.`);
  try {
    return await recordChange(
      db,
      actor,
      projectId,
      canKeepFieldRecords,
      { objectType: 'material_source', action: 'material_source.added' },
      async (tx) => {
        if ((await repo.listSources(tx, projectId)).some((s) => s.name.toLowerCase() === input.name.toLowerCase()))
          throw taken();
        const factor = await asAppError(() => conversionFactor(input.weighedLoads), 'weighedLoads.');
        const row = await repo.insertSource(tx, {
          projectId,
          name: input.name,
          weighedLoads: input.weighedLoads,
          factorComputed: factor.computed,
          factorUsed: factor.used,
          statedMoisturePercent: input.statedMoisturePercent ?? null,
        });
        const view = presentSource(row);
        return { id: row.id, after: view, value: view };
      },
    );
  } catch (err) {
    if (isUniqueViolation(err)) throw taken();
    throw err;
  }
}

/** One page of scale tickets (newest first), each with its source's conversion. */
export async function listScaleTickets(db: Db, actor: Actor, projectId: string, query: PageQuery) {
  await loadProjectAccess(db, actor, projectId);
  const [rows, sources] = await Promise.all([
    repo.pageScaleTickets(db, projectId, query),
    repo.listSources(db, projectId),
  ]);
  const byId = new Map(sources.map((s) => [s.id, s]));
  return pageOf(
    rows,
    query.limit,
    (r) => ({ at: r.pageKey, id: r.ticket.id }),
    (r) => presentScaleTicket(r.ticket, byId.get(r.ticket.sourceId)),
  );
}

/** A weighed load; a ticket number already on the project is refused (409), never saved twice. */
export async function addScaleTicket(db: Db, actor: Actor, projectId: string, input: CreateScaleTicketInput) {
  const duplicate = () =>
    conflict('DUPLICATE_TICKET_NUMBER', `Scale ticket ${input.ticketNumber} is already recorded on this project.`);
  try {
    return await recordChange(
      db,
      actor,
      projectId,
      canKeepFieldRecords,
      { objectType: 'scale_ticket', action: 'scale_ticket.added' },
      async (tx) => {
        await itemMeasuredBy(tx, projectId, input.bidItemId, 'weight');
        const source = await repo.findSource(tx, projectId, input.sourceId);
        if (!source) throw validationFailed([{ path: 'sourceId', message: 'No such material source on this project' }]);
        if (await repo.ticketNumberTaken(tx, projectId, input.ticketNumber)) throw duplicate();
        const netTons = await asAppError(() => netWeight(input.grossTons, input.tareTons));
        const row = await repo.insertScaleTicket(tx, {
          ...input,
          moisturePercent: input.moisturePercent ?? null,
          netTons,
          projectId,
          createdByUserId: actor.userId,
        });
        const view = presentScaleTicket(row, source);
        return { id: row.id, after: view, value: view };
      },
    );
  } catch (err) {
    if (isUniqueViolation(err)) throw duplicate();
    throw err;
  }
}
