/** A field path as zod gives it: `['stations', 3, 'station']`. */
export type FieldPath = readonly (string | number)[];

/** One problem with an input: where (a dotted path such as `stations.3.station`) and what. */
export interface DomainIssue {
  path: string;
  message: string;
}

/** Stable codes a route maps to HTTP statuses (all are client errors: 400, except UNKNOWN_CALC_METHOD: 404). */
export const DOMAIN_ERROR_CODES = [
  'VALIDATION_FAILED',
  'UNKNOWN_CALC_METHOD',
  'STATIONS_NOT_INCREASING',
  'OFFSETS_NOT_INCREASING',
  'NO_OVERLAP',
  'PRISMOIDAL_NEEDS_ODD_STATIONS',
  'PRISMOIDAL_UNEQUAL_INTERVALS',
  'RAGGED_GRID',
  'GRID_TOO_SMALL',
  'SOIL_CLASS_REQUIRED',
  'BENCHING_NOT_ALLOWED',
  'SHORT_TERM_DEPTH_EXCEEDED',
  'LENGTH_REQUIRED',
  'DEGENERATE_SURFACE',
  'INVALID_NUMBER',
  'INVALID_QUANTITY',
  'UNIT_MISMATCH',
  'METHOD_NOT_BILLABLE',
  'SLOPED_PIT_ON_SLOPING_GROUND',
  'DUPLICATE_POINT',
  'INVALID_FACE',
  'BREAKLINE_CONFLICT',
] as const;
export type DomainErrorCode = (typeof DOMAIN_ERROR_CODES)[number];

export function pathToString(path: FieldPath | string): string {
  return typeof path === 'string' ? path : path.map(String).join('.');
}

/**
 * The engine's one error type: thrown by the pure functions and by `runCalc` for bad input. It always names
 * the field (`path`), and `issues` lists every problem found (at least one).
 */
export class DomainError extends Error {
  override readonly name = 'DomainError';
  readonly code: DomainErrorCode;
  readonly path: string;
  readonly issues: DomainIssue[];

  constructor(code: DomainErrorCode, message: string, path: FieldPath | string = [], issues?: DomainIssue[]) {
    super(message);
    this.code = code;
    this.path = pathToString(path);
    this.issues = issues && issues.length > 0 ? issues : [{ path: this.path, message }];
  }
}

export function isDomainError(error: unknown): error is DomainError {
  return error instanceof DomainError;
}

/** Throws INVALID_NUMBER unless `value` is a finite number (NaN and Infinity never reach a formula). */
export function assertFinite(value: number, path: FieldPath | string): void {
  if (!Number.isFinite(value)) throw new DomainError('INVALID_NUMBER', `Expected a finite number, got ${value}`, path);
}

/** Throws INVALID_NUMBER unless `value` is finite and >= 0 (or > 0 with `strict`). */
export function assertNonNegative(value: number, path: FieldPath | string, strict = false): void {
  assertFinite(value, path);
  if (strict ? value <= 0 : value < 0) {
    throw new DomainError(
      'INVALID_NUMBER',
      `Expected a number ${strict ? 'above' : 'at or above'} 0, got ${value}`,
      path,
    );
  }
}
