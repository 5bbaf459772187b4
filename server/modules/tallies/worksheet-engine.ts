import type { CalcMethod, MeasurementMethod } from '../../../src/shared/constants';
import { runCalc } from '../../../src/shared/domain/calc';
import { DomainError, isDomainError } from '../../../src/shared/domain/domain-error';
import { AppError } from '../../lib/app-error';

export type WorksheetResult = Record<string, unknown> & { trail?: string[] };

/** Worksheets that measure a pay quantity; the calc method of each has the same name. */
const BILLABLE: readonly MeasurementMethod[] = ['end-area', 'grid', 'pit', 'trench', 'load-count', 'surface'];

const NOT_BILLABLE: Partial<Record<MeasurementMethod, string>> = {
  spoil: 'The spoil planner sizes a pile from a volume already measured; it does not measure a pay quantity.',
  'mass-haul': 'Mass haul gives overhaul in station-yards, which is not a pay unit of the bid schedule; enter it as a manual tally with its basis.',
};

/** Runs the worksheet with the engine's runCalc on the server (the authoritative result); bad inputs answer 400. */
export function runWorksheet(method: MeasurementMethod, inputs: Record<string, unknown>): WorksheetResult {
  const refuse = NOT_BILLABLE[method] ?? (BILLABLE.includes(method) ? null : `The ${method} method has no worksheet; enter a manual quantity with its basis.`);
  if (refuse) throw new AppError(400, 'METHOD_NOT_BILLABLE', refuse, [{ path: 'method', message: refuse }]);
  try {
    return runCalc(method as CalcMethod, inputs) as unknown as WorksheetResult;
  } catch (err) {
    if (isDomainError(err)) throw worksheetError(err);
    throw err;
  }
}

function worksheetError(err: DomainError): AppError {
  const details = err.issues.map((i) => ({ path: i.path && i.path !== '(body)' ? `inputs.${i.path}` : 'inputs', message: i.message }));
  return new AppError(400, err.code === 'VALIDATION_FAILED' ? 'WORKSHEET_INPUT_INVALID' : err.code, `The worksheet inputs need attention: ${err.message}`, details);
}
