import { METHOD_BILLING, type CalcMethod, type MeasurementMethod } from '../../../src/shared/constants';
import { runCalc } from '../../../src/shared/domain/calc';
import { DomainError, isDomainError } from '../../../src/shared/domain/domain-error';
import { AppError } from '../../lib/app-error';
import type { ComputePool } from '../../lib/compute/compute-pool';

export type WorksheetResult = Record<string, unknown> & { trail?: string[] };

/** Worksheets with more values than this run in the compute pool's worker threads rather than the request thread. */
export const INLINE_WORKSHEET_VALUES = 5_000;

/** Counts the values in a parsed body, stopping once past `cap` (so counting a large body costs little). */
export function countValues(value: unknown, cap: number): number {
  let count = 0;
  const stack: unknown[] = [value];
  while (stack.length > 0 && count <= cap) {
    const v = stack.pop();
    count++;
    if (Array.isArray(v)) stack.push(...v);
    else if (v && typeof v === 'object') stack.push(...Object.values(v));
  }
  return count;
}

/**
 * Runs the worksheet with the engine's runCalc on the server (the authoritative result); bad inputs answer 400.
 * Large worksheets run in the compute pool (503 with Retry-After when it is full or the time limit passes).
 */
export async function runWorksheet(
  method: MeasurementMethod,
  inputs: Record<string, unknown>,
  compute?: ComputePool,
): Promise<WorksheetResult> {
  // Which methods bill is the closed table METHOD_BILLING (src/shared/constants.ts); a worksheet's calc method has its name.
  const billing = METHOD_BILLING[method];
  const refuse = !billing.bills
    ? billing.reason
    : billing.yields === 'direct'
      ? `The ${method} method has no worksheet; enter a direct quantity with its basis.`
      : null;
  if (refuse) throw new AppError(400, 'METHOD_NOT_BILLABLE', refuse, [{ path: 'method', message: refuse }]);
  if (compute && countValues(inputs, INLINE_WORKSHEET_VALUES) > INLINE_WORKSHEET_VALUES) {
    const outcome = await compute.run({ kind: 'calc', method, input: inputs });
    if (outcome.ok) return JSON.parse(outcome.json) as WorksheetResult;
    throw worksheetError(new DomainError(outcome.code as DomainError['code'], outcome.message, [], outcome.details));
  }
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
