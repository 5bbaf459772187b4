import { moistureCorrected, tonsToCubicYards } from '../../../src/shared/domain/provisions/weight';
import type { MaterialSourceView, ScaleTicketView } from '../../../src/shared/schemas/provisions/views';
import type { MaterialSourceRow, ScaleTicketRow } from './scale-tickets.repository';

export function presentSource(r: MaterialSourceRow): MaterialSourceView {
  return {
    id: r.id,
    name: r.name,
    weighedLoads: r.weighedLoads as MaterialSourceView['weighedLoads'],
    factorComputed: r.factorComputed,
    factorUsed: r.factorUsed,
    statedMoisturePercent: r.statedMoisturePercent,
  };
}

export function presentScaleTicket(r: ScaleTicketRow, source: MaterialSourceRow | undefined): ScaleTicketView {
  const stated = source?.statedMoisturePercent;
  const payTons =
    stated === null || stated === undefined ? r.netTons : moistureCorrected(r.netTons, r.moisturePercent, stated);
  const volume = source ? tonsToCubicYards(payTons, source.factorUsed) : { computedCy: 0, payCy: 0 };
  return {
    id: r.id,
    bidItemId: r.bidItemId,
    sourceId: r.sourceId,
    ticketNumber: r.ticketNumber,
    weighedOn: r.weighedOn,
    grossTons: r.grossTons,
    tareTons: r.tareTons,
    netTons: r.netTons,
    material: r.material,
    moisturePercent: r.moisturePercent,
    scaleCheckerInitials: r.scaleCheckerInitials,
    deliveryCheckerInitials: r.deliveryCheckerInitials,
    payTons,
    computedCy: volume.computedCy,
    bandedCy: volume.payCy,
  };
}
