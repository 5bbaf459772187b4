import { DomainError, assertNonNegative } from '../domain-error';
import { lineAmountCents, percentOfCents, sumCents, type Cents } from '../money';

/**
 * A force account daily sheet (MoDOT EPG 109.5; TxDOT Construction Contract Administration Manual): labor,
 * equipment (working and standby hours, each at its own rate) and materials on invoice, each group with the
 * markup the contract sets. Every line is rounded once to the cent; each markup once on its group's subtotal.
 */
export interface LaborLine {
  trade: string;
  hours: number;
  rateCents: Cents;
}

export interface EquipmentLine {
  unit: string;
  hours: number;
  rateCents: Cents;
  standbyHours: number;
  standbyRateCents: Cents;
}

export interface MaterialLine {
  description: string;
  invoiceCents: Cents;
}

/** Markups in percent per group, as the contract sets them. */
export interface ForceAccountMarkups {
  laborPercent: number;
  equipmentPercent: number;
  materialPercent: number;
}

export interface DailySheetInput {
  labor: readonly LaborLine[];
  equipment: readonly EquipmentLine[];
  materials: readonly MaterialLine[];
  markups: ForceAccountMarkups;
}

export interface GroupTotal {
  subtotalCents: Cents;
  markupCents: Cents;
  totalCents: Cents;
}

export interface DailySheetTotals {
  labor: GroupTotal;
  equipment: GroupTotal;
  materials: GroupTotal;
  /** Sum of the three group totals. */
  totalCents: Cents;
}

function hoursOk(hours: number, path: (string | number)[]): void {
  assertNonNegative(hours, path);
  if (hours > 24) throw new DomainError('INVALID_QUANTITY', 'A day has at most 24 hours', path);
}

function group(lines: readonly Cents[], percent: number): GroupTotal {
  const subtotalCents = sumCents(lines);
  const markupCents = percentOfCents(subtotalCents, percent);
  return { subtotalCents, markupCents, totalCents: sumCents([subtotalCents, markupCents]) };
}

export function dailySheetTotals(sheet: DailySheetInput): DailySheetTotals {
  const { markups } = sheet;
  assertNonNegative(markups.laborPercent, ['markups', 'laborPercent']);
  assertNonNegative(markups.equipmentPercent, ['markups', 'equipmentPercent']);
  assertNonNegative(markups.materialPercent, ['markups', 'materialPercent']);
  const labor = sheet.labor.map((line, i) => {
    hoursOk(line.hours, ['labor', i, 'hours']);
    assertNonNegative(line.rateCents, ['labor', i, 'rateCents']);
    return lineAmountCents(line.hours, line.rateCents);
  });
  const equipment = sheet.equipment.map((line, i) => {
    hoursOk(line.hours, ['equipment', i, 'hours']);
    hoursOk(line.standbyHours, ['equipment', i, 'standbyHours']);
    if (line.hours + line.standbyHours > 24) {
      throw new DomainError('INVALID_QUANTITY', 'Working and standby hours add up to more than 24', ['equipment', i]);
    }
    assertNonNegative(line.rateCents, ['equipment', i, 'rateCents']);
    assertNonNegative(line.standbyRateCents, ['equipment', i, 'standbyRateCents']);
    return sumCents([
      lineAmountCents(line.hours, line.rateCents),
      lineAmountCents(line.standbyHours, line.standbyRateCents),
    ]);
  });
  const materials = sheet.materials.map((line, i) => {
    assertNonNegative(line.invoiceCents, ['materials', i, 'invoiceCents']);
    return line.invoiceCents;
  });
  const totals = {
    labor: group(labor, markups.laborPercent),
    equipment: group(equipment, markups.equipmentPercent),
    materials: group(materials, markups.materialPercent),
  };
  return {
    ...totals,
    totalCents: sumCents([totals.labor.totalCents, totals.equipment.totalCents, totals.materials.totalCents]),
  };
}
