import { dailySheetTotals, type DailySheetInput } from '../../../src/shared/domain/provisions/force-account';
import type { DailySheetView } from '../../../src/shared/schemas/provisions/views';
import type { DailySheetRow } from './force-account.repository';

export type { DailySheetView };

export function presentSheet(r: DailySheetRow): DailySheetView {
  const lines = r.lines as DailySheetInput;
  return {
    id: r.id,
    changeOrderId: r.changeOrderId,
    workedOn: r.workedOn,
    description: r.description,
    lines,
    totals: dailySheetTotals(lines),
    totalCents: r.totalCents,
    contractorSignedAt: r.contractorSignedAt?.toISOString() ?? null,
    gcSignedAt: r.gcSignedAt?.toISOString() ?? null,
    complete: r.contractorSignedAt !== null && r.gcSignedAt !== null,
  };
}
