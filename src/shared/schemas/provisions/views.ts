import type { AdjustmentKind } from '../../constants';
import type { DailySheetInput, DailySheetTotals } from '../../domain/provisions/force-account';
import type { StoredPeriodAccount } from '../../domain/provisions/stored-materials';
import type { TicketFlag, TicketTotal } from '../../domain/provisions/truck-measure';

/** Responses of the measurement and payment provisions routes (issue 15), read by the screens. */
export interface TruckView {
  id: string;
  label: string;
  hauler: string;
  bedVolumeCy: number;
  measuredBy: string;
  measuredOn: string;
}

export interface TruckTicketView {
  id: string;
  bidItemId: string;
  deliveredOn: string;
  truckLabel: string;
  material: string;
  source: string;
  loadedAt: string;
  deliveredTo: string;
  loadCheckerInitials: string;
  deliveryCheckerInitials: string;
  loadVolumeCy: number | null;
  volumeCy: number;
  flags: TicketFlag[];
}

export interface TicketTotalsView {
  byDay: TicketTotal[];
  byItem: TicketTotal[];
}

export interface MaterialSourceView {
  id: string;
  name: string;
  weighedLoads: { netTons: number; volumeCy: number }[];
  factorComputed: number;
  factorUsed: number;
  statedMoisturePercent: number | null;
}

export interface ScaleTicketView {
  id: string;
  bidItemId: string;
  sourceId: string;
  ticketNumber: string;
  weighedOn: string;
  grossTons: number;
  tareTons: number;
  netTons: number;
  material: string;
  moisturePercent: number | null;
  scaleCheckerInitials: string;
  deliveryCheckerInitials: string;
  /** Net weight after the moisture correction (tons, to 0.01). */
  payTons: number;
  /** Volume with the source's factor: 0.01 CY computed, and the 0.5 CY banded figure. */
  computedCy: number;
  bandedCy: number;
}

export interface DailySheetView {
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
}

export interface StoredMaterialView {
  id: string;
  bidItemId: string;
  description: string;
  unit: string;
  unitCostCents: number;
  neededQuantity: number;
  storedAt: string;
  movements: { id: string; kind: 'added' | 'used'; movedOn: string; quantity: number; invoiceRef: string }[];
  /** The running account for the period asked (without one: everything to date as this period). */
  account: StoredPeriodAccount;
}

export interface PayAdjustmentView {
  id: string;
  kind: AdjustmentKind;
  appliesOn: string;
  description: string;
  amountCents: number;
  basis: Record<string, unknown>;
}
