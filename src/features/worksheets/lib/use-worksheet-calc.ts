import type { CalcMethod } from '@/shared/constants';
import { useLiveCalc } from './live-calc';
import { useReportInputs, type ReportInputs } from './stable';

/** A worksheet's live result, and its inputs reported to the screen whenever they give one. */
export function useWorksheetCalc<M extends CalcMethod>(method: M, input: unknown, onInputs: ReportInputs, delayMs = 0) {
  const outcome = useLiveCalc(method, input, delayMs);
  useReportInputs(input, outcome.result, onInputs);
  return outcome;
}
