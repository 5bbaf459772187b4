import { isDomainError } from '../domain-error';
import { lineAmountCents, subtractCents, type Cents } from '../money';
import { endAreaVolumes } from './end-area';
import type { StationInput } from './end-area-core';
import type { LengthUnit } from './units';

export type ReconciledMethod = 'average-end-area' | 'prismoidal' | 'surface';

export interface ReconciliationRow {
  method: ReconciledMethod;
  /** Volume of the part compared (cut or fill), CY (ft) or m3 (m); null when the method cannot be used. */
  volume: number | null;
  /** Why the method gave no volume (the prismoidal formula needs an odd count of equally spaced pairs). */
  reason: string | null;
  /** volume x the item's unit price, rounded to the cent once (money.ts). */
  amountCents: Cents | null;
  /** Against the surface-to-surface volume: volume - surface, as a percent of the surface volume, and in cents. */
  differencePercent: number | null;
  differenceCents: Cents | null;
}

export interface ReconciliationInput {
  unit: LengthUnit;
  /** The cross sections' end areas (as the end-area worksheet stores them). */
  stations: readonly StationInput[];
  /** The same part's volume by surface to surface (the exact overlay). */
  surfaceVolume: number;
  part: 'cut' | 'fill';
  unitPriceCents: Cents;
}

/**
 * One item measured both by sections and by surfaces, side by side: average end area and prismoidal over the
 * sections (end-area.ts), surface to surface from the surfaces, each priced at the item's unit price, with the
 * difference of each section method from the surface figure in percent and in dollars. The surface figure is the
 * reference: it is exact for the two surveyed surfaces, while the section methods assume the ground between
 * sections (published comparisons report several percent between the methods at 100 ft spacing).
 */
export function reconcileMethods(input: ReconciliationInput): ReconciliationRow[] {
  const surfaceAmount = lineAmountCents(input.surfaceVolume, input.unitPriceCents);
  const row = (method: ReconciledMethod, volume: number | null, reason: string | null): ReconciliationRow => {
    if (volume === null)
      return { method, volume, reason, amountCents: null, differencePercent: null, differenceCents: null };
    const amount = lineAmountCents(volume, input.unitPriceCents);
    return {
      method,
      volume,
      reason,
      amountCents: amount,
      differencePercent:
        input.surfaceVolume === 0 ? null : ((volume - input.surfaceVolume) / input.surfaceVolume) * 100,
      differenceCents: subtractCents(amount, surfaceAmount),
    };
  };
  const bySections = (formula: 'average-end-area' | 'prismoidal') => {
    try {
      const r = endAreaVolumes({ unit: input.unit, stations: input.stations, formula });
      return row(formula, input.part === 'cut' ? r.cut : r.fill, null);
    } catch (err) {
      if (!isDomainError(err)) throw err;
      return row(formula, null, err.message);
    }
  };
  return [bySections('average-end-area'), bySections('prismoidal'), row('surface', input.surfaceVolume, null)];
}
