import type { z } from 'zod';
import { CALC_METHODS, type CalcMethod } from '../constants';
import { calcSchemas, type CalcInput } from '../schemas/calc';
import { DomainError } from './domain-error';
import { endAreaVolumes } from './earthwork/end-area';
import { gridVolume } from './earthwork/grid';
import { loadCount } from './earthwork/load-count';
import { massHaul } from './earthwork/mass-haul';
import { pitVolume } from './earthwork/pit';
import { sectionAreas } from './earthwork/section';
import { spoilPlan } from './earthwork/spoil';
import { surfaceVolume } from './earthwork/surface';
import { convertVolume } from './earthwork/swell';
import { trenchVolume } from './earthwork/trench';
import { payApplication } from './pay-app';
import { quantityVariance } from './variance';

const runners = {
  section: (input: CalcInput<'section'>) => sectionAreas(input),
  'end-area': (input: CalcInput<'end-area'>) => endAreaVolumes(input),
  grid: (input: CalcInput<'grid'>) => gridVolume(input),
  pit: (input: CalcInput<'pit'>) => pitVolume(input),
  trench: (input: CalcInput<'trench'>) => trenchVolume(input),
  convert: (input: CalcInput<'convert'>) => convertVolume(input),
  'load-count': (input: CalcInput<'load-count'>) => loadCount(input),
  spoil: (input: CalcInput<'spoil'>) => spoilPlan(input),
  'mass-haul': (input: CalcInput<'mass-haul'>) => massHaul(input),
  surface: (input: CalcInput<'surface'>) => surfaceVolume(input),
  variance: (input: CalcInput<'variance'>) => quantityVariance(input),
  'pay-app': (input: CalcInput<'pay-app'>) => payApplication(input),
} satisfies { [M in CalcMethod]: (input: CalcInput<M>) => unknown };

export type CalcResult<M extends CalcMethod> = ReturnType<(typeof runners)[M]>;

export interface CalcMethodEntry<M extends CalcMethod> {
  schema: (typeof calcSchemas)[M];
  run: (input: CalcInput<M>) => CalcResult<M>;
}

/** Each method's request schema and pure function (the function assumes input the schema accepted). */
export const calcMethods: { [M in CalcMethod]: CalcMethodEntry<M> } = Object.fromEntries(
  CALC_METHODS.map((m) => [m, { schema: calcSchemas[m], run: runners[m] }]),
) as { [M in CalcMethod]: CalcMethodEntry<M> };

export function isCalcMethod(name: string): name is CalcMethod {
  return (CALC_METHODS as readonly string[]).includes(name);
}

function zodToDomainError(error: z.ZodError): DomainError {
  const issues = error.issues.map((i) => ({ path: i.path.map(String).join('.') || '(body)', message: i.message }));
  const first = issues[0]!;
  return new DomainError('VALIDATION_FAILED', `${first.path}: ${first.message}`, first.path, issues);
}

/**
 * Parses `input` with the method's schema, then computes. Throws DomainError: UNKNOWN_CALC_METHOD (404),
 * VALIDATION_FAILED with every issue and its field path, or an engine code (also a 400) with its path.
 */
export function runCalc<M extends CalcMethod>(method: M, input: unknown): CalcResult<M>;
export function runCalc(method: string, input: unknown): unknown;
export function runCalc(method: string, input: unknown): unknown {
  if (!isCalcMethod(method)) {
    throw new DomainError('UNKNOWN_CALC_METHOD', `Unknown calculation method "${method}"; use one of ${CALC_METHODS.join(', ')}`, ['method']);
  }
  const entry = calcMethods[method] as unknown as { schema: z.ZodType; run: (i: unknown) => unknown };
  const parsed = entry.schema.safeParse(input);
  if (!parsed.success) throw zodToDomainError(parsed.error);
  return entry.run(parsed.data);
}
