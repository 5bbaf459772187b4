import type { MeasurementMethod } from '../../../src/shared/constants';
import { DomainError, isDomainError } from '../../../src/shared/domain/domain-error';
import { endAreaVolumes, type EndAreaInput } from '../../../src/shared/domain/earthwork/end-area';
import { gridVolume, type GridInput } from '../../../src/shared/domain/earthwork/grid';
import { loadCount, type LoadCountInput } from '../../../src/shared/domain/earthwork/load-count';
import { pitVolume, type PitInput } from '../../../src/shared/domain/earthwork/pit';
import { trenchVolume, type TrenchInput } from '../../../src/shared/domain/earthwork/trench';
import { AppError } from '../../lib/app-error';

export type WorksheetResult = Record<string, unknown> & { trail?: string[] };

/**
 * The quantity engine for the worksheets a tally can bill. The engine's `runCalc` (src/shared/domain/calc.ts)
 * was not in the tree when this module was written; this calls the same pure functions directly and is the one
 * place to switch to `runCalc(method, inputs)` when it lands.
 */
const ENGINE: Partial<Record<MeasurementMethod, (inputs: never) => unknown>> = {
  'end-area': (i: EndAreaInput) => endAreaVolumes(i),
  grid: (i: GridInput) => gridVolume(i),
  pit: (i: PitInput) => pitVolume(i),
  trench: (i: TrenchInput) => trenchVolume(i),
  'load-count': (i: LoadCountInput) => loadCount(i),
};

const NOT_BILLABLE: Partial<Record<MeasurementMethod, string>> = {
  spoil: 'The spoil planner sizes a pile from a volume already measured; it does not measure a pay quantity.',
  'mass-haul': 'Mass haul gives overhaul in station-yards, which is not a pay unit of the bid schedule; enter it as a manual tally with its basis.',
};

/** Runs the worksheet on the server (its result is the authoritative one); bad inputs answer 400 with paths. */
export function runWorksheet(method: MeasurementMethod, inputs: Record<string, unknown>): WorksheetResult {
  const refuse = NOT_BILLABLE[method];
  if (refuse) throw new AppError(400, 'METHOD_NOT_BILLABLE', refuse, [{ path: 'method', message: refuse }]);
  const run = ENGINE[method];
  if (!run) {
    const message = `The ${method} worksheet is not available for tallies yet; enter a manual quantity with its basis.`;
    throw new AppError(400, 'METHOD_NOT_AVAILABLE', message, [{ path: 'method', message }]);
  }
  try {
    return run(inputs as never) as WorksheetResult;
  } catch (err) {
    if (isDomainError(err)) throw worksheetError(err);
    // A shape the engine cannot read (a missing list, a string for a number) fails inside it.
    const message = `The inputs do not fit the ${method} worksheet: ${err instanceof Error ? err.message : String(err)}`;
    throw new AppError(400, 'WORKSHEET_INPUT_INVALID', message, [{ path: 'inputs', message }]);
  }
}

function worksheetError(err: DomainError): AppError {
  const details = err.issues.map((i) => ({ path: i.path ? `inputs.${i.path}` : 'inputs', message: i.message }));
  return new AppError(400, err.code === 'VALIDATION_FAILED' ? 'WORKSHEET_INPUT_INVALID' : err.code, err.message, details);
}
