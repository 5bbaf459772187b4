import {
  dailySheetTotals,
  type DailySheetInput,
  type DailySheetTotals,
} from '../../../src/shared/domain/provisions/force-account';
import type { DailySheetRow } from './force-account.repository';

export type DailySheetView = {
  id: string;
  changeOrderId: string;
  workedOn: string;
  description: string;
  lines: DailySheetInput;
  totals: DailySheetTotals;
  totalCents: number;
  contractorSignedAt: string | null;
  gcSignedAt: string | null;
  /** Signed by both sides: only then does the day count on a pay application. */
  complete: boolean;
};

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
