import type { MeasurementBasis, PayUnit, UnitSystem } from '../../../src/shared/constants';
import { billedQuantity } from '../../../src/shared/domain/billed-quantity';
import { isDomainError } from '../../../src/shared/domain/domain-error';
import type { CreateTallyInput, TallyResult } from '../../../src/shared/schemas/tally';
import { AppError } from '../../lib/app-error';
import type { ComputePool } from '../../lib/compute/compute-pool';
import { runWorksheet } from './worksheet-engine';

export type PayItem = { itemNumber: string; payUnit: PayUnit; basis: MeasurementBasis };
export type MaterialFactors = { swellPercent: number; shrinkagePercent: number; units: UnitSystem };

type TallyQuantityInput = Pick<
  CreateTallyInput,
  'method' | 'inputs' | 'component' | 'measuredBasis' | 'density' | 'quantity' | 'manualBasis'
>;

/**
 * The tally's quantity in the bid item's pay unit and basis, computed on the server with the same pure function
 * the worksheet preview uses (src/shared/domain/billed-quantity.ts); the client's number is never taken.
 */
export async function computeTally(
  input: TallyQuantityInput,
  item: PayItem,
  f: MaterialFactors,
  compute?: ComputePool,
): Promise<TallyResult> {
  const engine = input.method === 'manual' ? null : await runWorksheet(input.method, input.inputs ?? {}, compute);
  try {
    const bill = billedQuantity(input.method, input.inputs ?? null, engine, item, f, {
      component: input.component,
      measuredBasis: input.measuredBasis,
      density: input.density,
      directQuantity: input.quantity,
    });
    const trail = input.method === 'manual' ? [...bill.trail, `Basis: ${input.manualBasis ?? ''}`] : bill.trail;
    return {
      engine,
      measured: input.method === 'manual' ? null : bill.measured,
      quantity: bill.quantity,
      unit: bill.unit,
      basis: bill.basis,
      trail,
    };
  } catch (err) {
    if (!isDomainError(err)) throw err;
    throw new AppError(400, err.code, err.message, err.issues);
  }
}
