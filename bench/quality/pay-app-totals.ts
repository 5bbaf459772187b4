import { payApplication, type PayAppLineInput } from '../../src/shared/domain/pay-app';
import { check, type SelfMeasuredBench } from '../types';

const ITEMS = 2000;
const PERIODS = 36;
const LIMIT_MS = 100;

/**
 * One pay application's totals on a 2,000-item schedule in its 36th period: each line's previous quantity is the
 * sum of the 35 earlier periods' measured quantities, then the arithmetic of src/shared/domain/pay-app.ts.
 */
const history: number[][] = Array.from({ length: ITEMS }, (_, i) =>
  Array.from({ length: PERIODS }, (_, p) => ((i * 7 + p * 13) % 40) + 0.25),
);

function totals(): number {
  const lines: PayAppLineInput[] = history.map((periods, i) => {
    let previous = 0;
    for (let p = 0; p < PERIODS - 1; p++) previous += periods[p]!;
    return {
      unitPriceCents: 125 + (i % 900) * 7,
      contractQuantity: 1000 + i,
      previousQuantity: Math.round(previous * 1e4) / 1e4,
      thisPeriodQuantity: periods[PERIODS - 1]!,
    };
  });
  return payApplication({ retainagePercent: 10, previousCertifiedCents: 0, lines }).currentDueCents;
}

export const payAppTotals: SelfMeasuredBench = {
  name: 'pay-app-totals-2000x36',
  async measure() {
    totals(); // warm-up
    let best = Infinity;
    for (let i = 0; i < 5; i++) {
      const start = performance.now();
      totals();
      best = Math.min(best, performance.now() - start);
    }
    return {
      checks: [check('totals', best, 'ms', '<', LIMIT_MS)],
      baseline: `${ITEMS} items, ${PERIODS} periods of history, fastest of 5`,
      figures: { seconds: Number((best / 1000).toPrecision(4)) },
    };
  },
};
