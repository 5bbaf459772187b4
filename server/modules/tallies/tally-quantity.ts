import type { MeasurementBasis, PayUnit, UnitSystem } from '../../../src/shared/constants';
import { roundTo } from '../../../src/shared/domain/rounding';
import { convertVolume } from '../../../src/shared/domain/earthwork/swell';
import { fmt } from '../../../src/shared/domain/earthwork/trail';
import { M3_PER_CY, M_PER_FT } from '../../../src/shared/domain/earthwork/units';
import type { CreateTallyInput, TallyComponent, TallyResult } from '../../../src/shared/schemas/tally';
import { AppError } from '../../lib/app-error';
import type { ComputePool } from '../../lib/compute/compute-pool';
import { runWorksheet, type WorksheetResult } from './worksheet-engine';

export type PayItem = { itemNumber: string; payUnit: PayUnit; basis: MeasurementBasis };
export type MaterialFactors = { swellPercent: number; shrinkagePercent: number; units: UnitSystem };
type Measured = NonNullable<TallyResult['measured']>;

/** Quantities are stored with 4 decimals (numeric(16,4)). */
const stored = (q: number) => roundTo(q, 4);
const unitMismatch = (message: string) => new AppError(400, 'UNIT_MISMATCH', message, [{ path: 'bidItemId', message }]);

function volumeOf(method: string, r: WorksheetResult, component: TallyComponent | undefined, basis: MeasurementBasis | undefined, item: PayItem): Measured {
  const unit = String(r.volumeUnit ?? '');
  if (method === 'load-count') {
    // Truck tickets: the engine turns loose loads into bank measure and rounds to the pay tenth.
    return { quantity: Number(r.payQuantity), unit, basis: 'bank', component: null };
  }
  if (method === 'pit' || method === 'trench') return { quantity: Number(r.volume), unit, basis: basis ?? 'bank', component: null };
  const part: TallyComponent = component ?? (item.basis === 'compacted' ? 'fill' : 'cut');
  // Common practice (US Navy EO manual, Table 4-1): cuts are measured in bank, fills in compacted measure.
  return { quantity: Number(r[part]), unit, basis: basis ?? (part === 'cut' ? 'bank' : 'compacted'), component: part };
}

function toPayVolume(m: Measured, item: PayItem, f: MaterialFactors, trail: string[]): number {
  let q = m.quantity;
  const from = m.unit === 'm3' ? 'm3' : m.unit === 'CY' ? 'CY' : f.units === 'metric' ? 'm3' : 'CY';
  if (from !== item.payUnit) {
    q = from === 'CY' ? q * M3_PER_CY : q / M3_PER_CY;
    trail.push(`${fmt(m.quantity, 3)} ${from} = ${fmt(q, 3)} ${item.payUnit} (1 CY = 0.764554857984 m3, exact)`);
  }
  if (m.basis && m.basis !== item.basis) {
    const c = convertVolume({ volume: q, from: m.basis, to: item.basis, swellPercent: f.swellPercent, shrinkagePercent: f.shrinkagePercent });
    trail.push(`Project material factors: swell ${fmt(f.swellPercent, 1)} %, shrinkage ${fmt(f.shrinkagePercent, 1)} %`, ...c.trail);
    q = c.volume;
  }
  return q;
}

function toPayLength(r: WorksheetResult, item: PayItem, trail: string[]): number {
  const runs = (r.runs as { length: number }[] | undefined) ?? [];
  const total = runs.reduce((s, run) => s + run.length, 0);
  const from = r.unit === 'm' ? 'm' : 'LF';
  trail.push(`Trench length = sum of ${runs.length} run length(s) = ${fmt(total, 2)} ${from === 'm' ? 'm' : 'ft'}`);
  if (from === item.payUnit) return total;
  const q = from === 'LF' ? total * M_PER_FT : total / M_PER_FT;
  trail.push(`${fmt(total, 2)} ${from} = ${fmt(q, 2)} ${item.payUnit} (1 ft = 0.3048 m, exact)`);
  return q;
}

/**
 * The tally's quantity in the bid item's pay unit and basis, computed on the server from the worksheet (or the
 * manual quantity), with every conversion written into the trail.
 */
export async function computeTally(input: Pick<CreateTallyInput, 'method' | 'inputs' | 'component' | 'measuredBasis' | 'quantity' | 'manualBasis'>, item: PayItem, f: MaterialFactors, compute?: ComputePool): Promise<TallyResult> {
  const isVolume = item.payUnit === 'CY' || item.payUnit === 'm3';
  if (input.method === 'manual') {
    const q = stored(input.quantity ?? 0);
    const trail = [`Manual quantity ${fmt(q, 4)} ${item.payUnit}${isVolume ? ` (${item.basis})` : ''}`, `Basis: ${input.manualBasis ?? ''}`];
    return { engine: null, measured: null, quantity: q, unit: item.payUnit, basis: isVolume ? item.basis : null, trail };
  }
  const engine = await runWorksheet(input.method, input.inputs ?? {}, compute);
  const trail = [...(engine.trail ?? [])];
  let quantity: number;
  let measured: Measured;
  if (isVolume) {
    measured = volumeOf(input.method, engine, input.component, input.measuredBasis, item);
    quantity = toPayVolume(measured, item, f, trail);
  } else if ((item.payUnit === 'LF' || item.payUnit === 'm') && input.method === 'trench') {
    quantity = toPayLength(engine, item, trail);
    measured = { quantity, unit: item.payUnit, basis: null, component: null };
  } else {
    throw unitMismatch(`Item ${item.itemNumber} is paid in ${item.payUnit}; the ${input.method} worksheet gives ${input.method === 'trench' ? 'a volume or a length' : 'a volume'}. Enter a manual quantity with its written basis instead.`);
  }
  quantity = stored(quantity);
  trail.push(`Tally quantity: ${fmt(quantity, 4)} ${item.payUnit}${isVolume ? ` ${item.basis}` : ''} for item ${item.itemNumber}`);
  return { engine, measured, quantity, unit: item.payUnit, basis: isVolume ? item.basis : null, trail };
}
