import type {
  CreateTruckInput,
  CreateTruckTicketInput,
  ImportTruckTicketsInput,
} from '../../../src/shared/schemas/provisions/tickets';
import { parseTruckTicketCsv, type TruckTicketRow } from '../../../src/shared/truck-ticket-csv';
import type { Page, PageQuery } from '../../../src/shared/schemas/paging';
import type { Db, Executor } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { conflict, validationFailed } from '../../lib/app-error';
import { pageOf } from '../../lib/paging';
import { loadProjectAccess } from '../projects/project-access';
import { canKeepFieldRecords } from '../../../src/shared/policies/field-records';
import { isUniqueViolation, itemMeasuredBy, recordChange } from '../field-records/record-change';
import { presentTicket, presentTotals, presentTruck, registerOf, type TruckTicketView } from './haul-tickets.presenter';
import * as repo from './haul-tickets.repository';

export async function listTrucks(db: Db, actor: Actor, projectId: string) {
  await loadProjectAccess(db, actor, projectId);
  return (await repo.listTrucks(db, projectId)).map(presentTruck);
}

export async function registerTruck(db: Db, actor: Actor, projectId: string, input: CreateTruckInput) {
  const taken = () => conflict('TRUCK_ALREADY_REGISTERED', `Truck ${input.label} is already on the register.`);
  try {
    return await recordChange(
      db,
      actor,
      projectId,
      canKeepFieldRecords,
      { objectType: 'truck', action: 'truck.registered' },
      async (tx) => {
        const existing = await repo.listTrucks(tx, projectId);
        if (existing.some((t) => t.label.toUpperCase() === input.label.toUpperCase())) throw taken();
        const row = await repo.insertTruck(tx, { ...input, projectId, createdByUserId: actor.userId });
        const view = presentTruck(row);
        return { id: row.id, after: view, value: view };
      },
    );
  } catch (err) {
    if (isUniqueViolation(err)) throw taken();
    throw err;
  }
}

/** One page of tickets (newest first), each checked against the register. */
export async function listTickets(
  db: Db,
  actor: Actor,
  projectId: string,
  query: repo.TicketFilter & PageQuery,
): Promise<Page<TruckTicketView>> {
  await loadProjectAccess(db, actor, projectId);
  const [rows, trucks] = await Promise.all([repo.pageTickets(db, projectId, query), repo.listTrucks(db, projectId)]);
  const register = registerOf(trucks);
  return pageOf(
    rows,
    query.limit,
    (r) => ({ at: r.pageKey, id: r.ticket.id }),
    (r) => presentTicket(r.ticket, register),
  );
}

/** Totals per day and per item over every ticket of the filter (the list itself is paged). */
export async function ticketTotals(db: Db, actor: Actor, projectId: string, filter: repo.TicketFilter) {
  await loadProjectAccess(db, actor, projectId);
  const [lines, trucks] = await Promise.all([
    repo.ticketTotalLines(db, projectId, filter),
    repo.listTrucks(db, projectId),
  ]);
  return presentTotals(lines, registerOf(trucks));
}

async function saveTickets(tx: Executor, actor: Actor, projectId: string, bidItemId: string, rows: TruckTicketRow[]) {
  await itemMeasuredBy(tx, projectId, bidItemId, 'truck_measure');
  const saved = await repo.insertTickets(
    tx,
    rows.map((r) => ({
      ...r,
      loadVolumeCy: r.loadVolumeCy ?? null,
      projectId,
      bidItemId,
      createdByUserId: actor.userId,
    })),
  );
  const register = registerOf(await repo.listTrucks(tx, projectId));
  return saved.map((r) => presentTicket(r, register));
}

/** A typed ticket. A ticket on an unregistered truck or above its bed volume is kept, and flagged. */
export async function addTicket(
  db: Db,
  actor: Actor,
  projectId: string,
  input: CreateTruckTicketInput,
): Promise<TruckTicketView> {
  const { bidItemId, ...row } = input;
  return recordChange(
    db,
    actor,
    projectId,
    canKeepFieldRecords,
    { objectType: 'truck_ticket', action: 'truck_ticket.added' },
    async (tx) => {
      const [view] = await saveTickets(tx, actor, projectId, bidItemId, [row]);
      return { id: view!.id, after: view, value: view! };
    },
  );
}

/** CSV import: every row checked first; one error keeps the whole file out (400 naming line and column). */
export async function importTickets(db: Db, actor: Actor, projectId: string, input: ImportTruckTicketsInput) {
  const parsed = parseTruckTicketCsv(input.csv);
  await loadProjectAccess(db, actor, projectId, canKeepFieldRecords);
  if (parsed.errors.length > 0)
    throw validationFailed(parsed.errors, 'Some rows of the file need attention; nothing was imported.');
  return recordChange(
    db,
    actor,
    projectId,
    canKeepFieldRecords,
    { objectType: 'project', action: 'truck_tickets.imported' },
    async (tx) => {
      const views = await saveTickets(tx, actor, projectId, input.bidItemId, parsed.rows);
      const flagged = views.filter((v) => v.flags.length > 0).length;
      return {
        id: projectId,
        after: { bidItemId: input.bidItemId, tickets: views.length, flagged },
        value: { imported: views.length, flagged, tickets: views },
      };
    },
  );
}
