import type { SelfMeasuredBench } from '../types';
import { apiThroughput } from './api-throughput';
import { clientBundle } from './client-bundle';
import { coldStart } from './cold-start';
import { lcp } from './lcp';
import { payAppTotals } from './pay-app-totals';

/** The measured budgets of the API, the client and the server (absolute limits, not ratios to a baseline). */
export const benchmarks: SelfMeasuredBench[] = [payAppTotals, clientBundle, coldStart, lcp, apiThroughput];
