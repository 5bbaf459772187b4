import { apiThroughput } from './api-throughput';
import { clientBundle } from './client-bundle';
import { coldStart } from './cold-start';
import { lcp } from './lcp';
import type { MeasuredBench } from './measured';
import { payAppTotals } from './pay-app-totals';

export const qualityBenches: MeasuredBench[] = [payAppTotals, clientBundle, coldStart, lcp, apiThroughput];
