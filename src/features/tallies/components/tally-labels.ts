import { methodBills, type MeasurementMethod, type PayUnit, type TallyStatus } from '@/shared/constants';

export const TALLY_STATUS_LABELS: Record<TallyStatus, string> = {
  draft: 'Draft',
  ready: 'Ready to bill',
  billed: 'Billed',
};
export const TALLY_STATUS_TONES: Record<TallyStatus, 'neutral' | 'clay' | 'spruce'> = {
  draft: 'neutral',
  ready: 'clay',
  billed: 'spruce',
};

/** Pay units no worksheet measures: counted, lump sum or by time; a tally states them directly with its basis. */
const DIRECT_UNITS: readonly PayUnit[] = ['EA', 'LS', 'DAY', 'HR'];

/** The worksheet that measures an item, or null when its tally is a direct quantity with basis and evidence. */
export function worksheetOf(item: { method: MeasurementMethod; payUnit: PayUnit }): MeasurementMethod | null {
  if (item.method === 'manual' || !methodBills(item.method) || DIRECT_UNITS.includes(item.payUnit)) return null;
  return item.method;
}
