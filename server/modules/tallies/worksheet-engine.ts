import { METHOD_BILLING, type CalcMethod, type MeasurementMethod } from '../../../src/shared/constants';
import { runCalc } from '../../../src/shared/domain/calc';
import { DomainError, isDomainError } from '../../../src/shared/domain/domain-error';
import { AppError } from '../../lib/app-error';

export type WorksheetResult = Record<string, unknown> & { trail?: string[] };

/** Runs the worksheet with the engine's runCalc on the server (the authoritative result); bad inputs answer 400. */
export function runWorksheet(method: MeasurementMethod, inputs: Record<string, unknown>): WorksheetResult {
  // Which methods bill is the closed table METHOD_BILLING (src/shared/constants.ts); a worksheet's calc method has its name.
  const billing = METHOD_BILLING[method];
  const refuse = !billing.bills
    ? billing.reason
    : billing.yields === 'direct'
      ? `The ${method} method has no worksheet; enter a direct quantity with its basis.`
      : null;
  if (refuse) throw new AppError(400, 'METHOD_NOT_BILLABLE', refuse, [{ path: 'method', message: refuse }]);
  try {
    return runCalc(method as CalcMethod, inputs) as unknown as WorksheetResult;
  } catch (err) {
    if (isDomainError(err)) throw worksheetError(err);
    throw err;
  }
}

function worksheetError(err: DomainError): AppError {
  const details = err.issues.map((i) => ({
    path: i.path && i.path !== '(body)' ? `inputs.${i.path}` : 'inputs',
    message: i.message,
  }));
  return new AppError(
    400,
    err.code === 'VALIDATION_FAILED' ? 'WORKSHEET_INPUT_INVALID' : err.code,
    `The worksheet inputs need attention: ${err.message}`,
    details,
  );
}
