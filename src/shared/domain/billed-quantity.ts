import {
  METHOD_BILLING,
  STORED_QUANTITY_DECIMALS,
  type MeasurementBasis,
  type MeasurementMethod,
  type PayUnit,
  type TallyComponent,
  type UnitSystem,
} from '../constants';
import { DomainError } from './domain-error';
import { payQuantityOf, precisionFor } from './provisions/precision';
import { measureFactors } from './earthwork/swell';
import { fmt, type Trail } from './earthwork/trail';
import { M3_PER_CY, M_PER_FT } from './earthwork/units';
import { roundTo } from './rounding';

/** The bid item a tally bills: its number (for the trail), pay unit and measurement basis. */
export interface BillItem {
  itemNumber: string;
  payUnit: PayUnit;
  basis: MeasurementBasis;
}

/** The project's material factors (editable defaults; agencies and soils differ). */
export interface BillFactors {
  swellPercent: number;
  shrinkagePercent: number;
  units: UnitSystem;
}

/** The tally's choices about the worksheet result. */
export interface BillOptions {
  /** Cut-and-fill worksheets: which part is billed (default: fill for a compacted item, else cut). */
  component?: TallyComponent | undefined;
  /** Measure the worksheet volume is in, where it differs from the method's usual one. */
  measuredBasis?: MeasurementBasis | undefined;
  /** Weight per BANK volume unit (short tons per bank CY, tonnes per bank m3): needed for TON and t items. */
  density?: number | null | undefined;
}

/** What the worksheet measured, before any conversion. */
export interface MeasuredQuantity {
  quantity: number;
  unit: string;
  basis: MeasurementBasis | null;
  component: TallyComponent | null;
}

export interface BilledQuantity {
  measured: MeasuredQuantity;
  /** In the item's pay unit and basis, rounded to the method's pay decimals. */
  quantity: number;
  unit: PayUnit;
  basis: MeasurementBasis | null;
  /** Each conversion, once, in order. */
  trail: Trail;
}

/** The engine's answer as the worksheets and the server hold it (the runCalc result of the method). */
export type WorksheetOutcome = Record<string, unknown>;

const VOLUME_UNITS: readonly PayUnit[] = ['CY', 'm3'];
const LENGTH_UNITS: readonly PayUnit[] = ['LF', 'm'];
const WEIGHT_UNITS: readonly PayUnit[] = ['TON', 't'];

const num = (v: unknown): number => (typeof v === 'number' ? v : Number(v));

function mismatch(item: BillItem, method: MeasurementMethod, gives: string): DomainError {
  return new DomainError(
    'UNIT_MISMATCH',
    `Item ${item.itemNumber} is paid in ${item.payUnit}; the ${method} worksheet gives ${gives}. Enter a direct quantity with its written basis instead.`,
    ['bidItemId'],
  );
}

/** Volume unit the worksheet result is in: its own label, else the project's system. */
function volumeUnitOf(result: WorksheetOutcome, units: UnitSystem): 'CY' | 'm3' {
  const label = String(result.volumeUnit ?? '');
  if (label === 'CY' || label === 'm3') return label;
  if (result.unit === 'm') return 'm3';
  if (result.unit === 'ft') return 'CY';
  return units === 'metric' ? 'm3' : 'CY';
}

/** Picks the measured volume out of the worksheet result. */
function measuredVolume(
  method: MeasurementMethod,
  result: WorksheetOutcome,
  item: BillItem,
  f: BillFactors,
  o: BillOptions,
  trail: Trail,
): MeasuredQuantity {
  const billing = METHOD_BILLING[method];
  const unit = volumeUnitOf(result, f.units);
  if (!billing.bills) throw new DomainError('METHOD_NOT_BILLABLE', billing.reason, ['method']);
  if (billing.components.length > 0) {
    const part: TallyComponent = o.component ?? (item.basis === 'compacted' ? 'fill' : 'cut');
    // Common practice (US Navy EO manual, Table 4-1): cuts are measured in bank, fills in compacted measure.
    const basis = o.measuredBasis ?? (part === 'cut' ? 'bank' : 'compacted');
    const quantity = num(result[part]);
    trail.push(`Measured ${part}: ${fmt(quantity, 3)} ${basis} ${unit}`);
    return { quantity, unit, basis, component: part };
  }
  if (method === 'load-count') {
    // Truck tickets measure loose volume in the truck bed (a state DOT construction manual, section 109.11).
    const quantity = num(result.looseVolume);
    const basis = o.measuredBasis ?? 'loose';
    trail.push(`Measured in the trucks: ${fmt(quantity, 2)} ${basis} ${unit}`);
    return { quantity, unit, basis, component: null };
  }
  const basis = o.measuredBasis ?? (billing.measuredBasis === 'by-component' ? 'bank' : billing.measuredBasis);
  const quantity = num(result.volume);
  trail.push(`Measured volume: ${fmt(quantity, 3)} ${basis} ${unit}`);
  return { quantity, unit, basis, component: null };
}

/**
 * The engine's own steps that the tally keeps. Truck tickets keep only the loose sum: the bill converts from the
 * loose measure once, to the item's basis, rather than to bank and back.
 */
function engineSteps(method: MeasurementMethod, result: WorksheetOutcome): Trail {
  const steps = Array.isArray(result.trail) ? (result.trail as unknown[]).map(String) : [];
  return method === 'load-count' ? steps.slice(0, 1) : steps;
}

/** Changes CY to m3 or back with the exact yard (1 yd = 0.9144 m, 1959). */
function toUnit(q: number, from: 'CY' | 'm3', to: 'CY' | 'm3', trail: Trail): number {
  if (from === to) return q;
  const out = from === 'CY' ? q * M3_PER_CY : q / M3_PER_CY;
  trail.push(`${fmt(q, 3)} ${from} = ${fmt(out, 3)} ${to} (1 CY = 0.764554857984 m3, exact)`);
  return out;
}

/**
 * Bank, loose and compacted measure (Nichols and Day, Moving the Earth, p. 2.51): loose = bank x (1 + swell),
 * compacted = bank x (1 - shrinkage). One step, straight from the measured basis to the pay basis.
 */
function toBasis(
  q: number,
  from: MeasurementBasis,
  to: MeasurementBasis,
  swell: number,
  shrinkage: number,
  source: string,
  trail: Trail,
): number {
  if (from === to) return q;
  if (shrinkage >= 100 || shrinkage <= -100)
    throw new DomainError('INVALID_NUMBER', 'Shrinkage must be between -100 and 100 percent', ['shrinkagePercent']);
  const f = measureFactors(swell, shrinkage);
  const factor = f[to] / f[from];
  const out = q * factor;
  const uses = [from, to].includes('loose') ? [`swell ${fmt(swell, 1)} %`] : [];
  if ([from, to].includes('compacted')) uses.push(`shrinkage ${fmt(shrinkage, 1)} %`);
  trail.push(
    `${from} to ${to} with ${uses.join(' and ')} (${source}): ${fmt(q, 3)} x ${fmt(factor, 4)} = ${fmt(out, 3)} ${to} ` +
      `(loose = bank x (1 + swell), compacted = bank x (1 - shrinkage); Nichols and Day, Moving the Earth, p. 2.51)`,
  );
  return out;
}

/**
 * The tally's billed quantity: the worksheet result (or a direct quantity) turned into the bid item's pay unit
 * and basis, then rounded to the method's pay decimals (truck measure to 0.1 from a 0.01 figure, the others to
 * the stored 4 decimals). Volume items: CY or m3 in bank, loose or compacted measure through the project's swell
 * and shrinkage (a truck-ticket worksheet's own swell where it states one). Length items: the trench run lengths.
 * Weight items: the bank volume times the density given. Pure; the worksheet preview and the server both call it.
 * Throws DomainError UNIT_MISMATCH (path bidItemId), METHOD_NOT_BILLABLE (method) (path density when a weight item has no density).
 */
/** The smallest step of a number of decimals, as written: 0 -> "1", 1 -> "0.1", 2 -> "0.01". */
const step = (decimals: number) => (decimals === 0 ? '1' : `0.${'0'.repeat(decimals - 1)}1`);

export function billedQuantity(
  method: MeasurementMethod,
  inputs: Record<string, unknown> | null,
  result: WorksheetOutcome | null,
  item: BillItem,
  factors: BillFactors,
  options: BillOptions & { directQuantity?: number | null } = {},
): BilledQuantity {
  const billing = METHOD_BILLING[method];
  if (!billing.bills) throw new DomainError('METHOD_NOT_BILLABLE', billing.reason, ['method']);
  const isVolume = VOLUME_UNITS.includes(item.payUnit);
  if (billing.yields === 'direct') {
    const trail: Trail = [];
    const quantity = roundTo(options.directQuantity ?? 0, STORED_QUANTITY_DECIMALS);
    trail.push(`Direct quantity ${fmt(quantity, 4)} ${item.payUnit}${isVolume ? ` (${item.basis})` : ''}`);
    const measured = { quantity, unit: item.payUnit, basis: isVolume ? item.basis : null, component: null };
    return { measured, quantity, unit: item.payUnit, basis: isVolume ? item.basis : null, trail };
  }
  if (!result) throw new DomainError('VALIDATION_FAILED', `The ${method} worksheet has no result`, ['inputs']);
  // The truck-ticket worksheet states the swell of the material hauled; the project's swell is the default.
  const ownSwell = method === 'load-count' && typeof inputs?.swellPercent === 'number';
  const swell = ownSwell ? (inputs.swellPercent as number) : factors.swellPercent;
  const swellSource = ownSwell ? 'the worksheet swell' : 'project material factors';
  const trail: Trail = engineSteps(method, result);
  let quantity: number;
  let measured: MeasuredQuantity;
  let basis: MeasurementBasis | null = null;
  if (LENGTH_UNITS.includes(item.payUnit)) {
    if (billing.yields !== 'volume-or-length') throw mismatch(item, method, 'a volume');
    const runs = (result.runs as { length: number }[] | undefined) ?? [];
    const total = runs.reduce((s, run) => s + num(run.length), 0);
    const from = result.unit === 'm' ? 'm' : 'LF';
    trail.push(`Length = sum of ${runs.length} run length${runs.length === 1 ? '' : 's'} = ${fmt(total, 2)} ${from}`);
    measured = { quantity: total, unit: from, basis: null, component: null };
    quantity = total;
    if (from !== item.payUnit) {
      quantity = from === 'LF' ? total * M_PER_FT : total / M_PER_FT;
      trail.push(`${fmt(total, 2)} ${from} = ${fmt(quantity, 2)} ${item.payUnit} (1 ft = 0.3048 m, exact)`);
    }
  } else if (isVolume || WEIGHT_UNITS.includes(item.payUnit)) {
    measured = measuredVolume(method, result, item, factors, options, trail);
    if (isVolume) {
      const v = toUnit(measured.quantity, measured.unit as 'CY' | 'm3', item.payUnit as 'CY' | 'm3', trail);
      quantity = toBasis(
        v,
        measured.basis ?? item.basis,
        item.basis,
        swell,
        factors.shrinkagePercent,
        swellSource,
        trail,
      );
      basis = item.basis;
    } else {
      const density = options.density;
      if (density === null || density === undefined || !(density > 0)) {
        throw new DomainError(
          'UNIT_MISMATCH',
          `Item ${item.itemNumber} is paid in ${item.payUnit}: give the material's density (${item.payUnit === 'TON' ? 'tons per bank CY' : 'tonnes per bank m3'})`,
          ['density'],
        );
      }
      const v = toUnit(measured.quantity, measured.unit as 'CY' | 'm3', item.payUnit === 'TON' ? 'CY' : 'm3', trail);
      const bank = toBasis(v, measured.basis ?? 'bank', 'bank', swell, factors.shrinkagePercent, swellSource, trail);
      quantity = bank * density;
      trail.push(
        `Weight = bank volume x density = ${fmt(bank, 3)} x ${fmt(density, 4)} = ${fmt(quantity, 3)} ${item.payUnit}`,
      );
    }
  } else {
    throw mismatch(item, method, billing.yields === 'volume-or-length' ? 'a volume or a length' : 'a volume');
  }
  // Pay precision has one source: DEFAULT_PAY_DECIMALS per pay unit (src/shared/domain/provisions/precision.ts).
  let decimals = STORED_QUANTITY_DECIMALS;
  if (billing.payRounding === 'pay-unit') {
    const precision = precisionFor(item.payUnit);
    quantity = payQuantityOf(quantity, precision);
    decimals = precision.payDecimals;
    trail.push(
      `Paid to ${step(precision.payDecimals)} from the ${step(precision.measuredDecimals)} figure (truck measure, state DOT construction manual section 109.11)`,
    );
  } else {
    quantity = roundTo(quantity, STORED_QUANTITY_DECIMALS);
  }
  trail.push(`Bills ${fmt(quantity, decimals)} ${item.payUnit}${basis ? ` ${basis}` : ''} to item ${item.itemNumber}`);
  return { measured, quantity, unit: item.payUnit, basis, trail };
}
