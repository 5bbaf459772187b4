import { z } from 'zod';
import type { PayAppStatus, PayUnit, VariationPreset } from '../constants';
import { MAX_CONTRACT_QUANTITY } from './bid-item';

export const forecastInputSchema = z
  .object({
    forecastQuantity: z.number().finite().min(0, 'A forecast cannot be negative').max(MAX_CONTRACT_QUANTITY),
    note: z.string().trim().max(1000).default(''),
  })
  .strict();
export type ForecastInput = z.infer<typeof forecastInputSchema>;

/** Where an item stands against its band: early warning is within the band but past 80 % of it. */
export const WATCH_STATUSES = ['within', 'early_warning', 'over', 'under', 'no_band'] as const;
export type WatchStatus = (typeof WATCH_STATUSES)[number];

export type VarianceRowView = {
  bidItemId: string;
  itemNumber: string;
  description: string;
  payUnit: PayUnit;
  unitPriceCents: number;
  isMajor: boolean;
  originalQuantity: number;
  currentContractQuantity: number;
  /** On certified and paid pay applications. */
  approvedToDate: number;
  /** On submitted pay applications, those in review, and those returned with a dispute (still claimed). */
  pending: number;
  forecast: { quantity: number; note: string; updatedAt: string; updatedBy: string } | null;
  /** The forecast, or approved + pending when there is none. */
  forecastAtCompletion: number;
  /** Null when the contract quantity is zero, or with no forecast while the quantity to date is short of it. */
  variancePercent: number | null;
  band: { overPercent: number; underPercent: number; lower: number; upper: number } | null;
  status: WatchStatus;
  quantityBeyondBand: number;
  amountBeyondBandCents: number;
  /** POST here to draft a change order for the quantity beyond the band (only when over or under). */
  draftChangeOrderPath: string | null;
  /** A change order still proposed that changes this item's quantity. */
  openChangeOrder: { id: string; number: number } | null;
  /** An allowance item whose quantities are force account days drawn on it, at its unit price. */
  drawnByForceAccount?: boolean;
};

export type EarnedPeriodView = {
  payAppId: string;
  number: number;
  periodEnd: string;
  status: PayAppStatus;
  earnedToDateCents: number;
  thisPeriodCents: number;
};

export type VarianceView = {
  preset: VariationPreset;
  /** The clause's name for people: FAR 52.211-18, 23 CFR 635.109(a)(3), or the contract's own band. */
  clause: string;
  earlyWarningPercent: number;
  originalContractAmountCents: number;
  rows: VarianceRowView[];
  periods: EarnedPeriodView[];
};
