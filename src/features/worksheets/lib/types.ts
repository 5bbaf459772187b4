import type { LengthUnit } from '@/shared/constants';
import { readTypedNumber } from '@/shared/parse-number';
import type { ReportInputs } from './stable';

/** The eight worksheets, in the order the picker lists them. */
export const WORKSHEET_METHODS = [
  'end-area',
  'grid',
  'pit',
  'trench',
  'load-count',
  'spoil',
  'surface',
  'mass-haul',
] as const;
export type WorksheetMethod = (typeof WORKSHEET_METHODS)[number];

export type WorksheetProps = {
  unit: LengthUnit;
  /** A saved tally's inputs to start from, or null for the sample. */
  initial: Record<string, unknown> | null;
  /** The project's default material factors. */
  defaults: { swellPercent: number; shrinkagePercent: number };
  /** Called with the engine inputs and result whenever they give one, and nulls while they do not. */
  onInputs: ReportInputs;
};

/** Registration options of a number box: thousands separators accepted, text that is not a number kept as text (the
 * schema then says "Not a number"), an empty box NaN ("Enter a number"). */
export const NUMBER_INPUT = { setValueAs: readTypedNumber } as const;
