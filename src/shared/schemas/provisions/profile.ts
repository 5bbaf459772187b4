import { z } from 'zod';
import {
  MAX_PAY_DECIMALS,
  MEASUREMENT_PROFILES,
  MEASUREMENT_STAGES,
  type MeasurementProfile,
  type MeasurementStage,
} from '../../constants';
import { isoDateSchema } from '../tally';
import { centsField, percentField, textField } from './fields';

const stageSchema = z
  .object({
    name: textField(120, 'A stage name'),
    percentOfItem: percentField,
    /** The day the stage was done (YYYY-MM-DD); absent or null: not done yet. */
    completedOn: isoDateSchema.nullable().optional(),
  })
  .strict();
const stepSchema = z.object({ contractEarnedPercent: percentField, mobilizationPercent: percentField }).strict();

/** Settings a profile reads; each is optional and checked against the profile by the server. */
export const profileSettingsSchema = z
  .object({
    /** plan_quantity and lump_sum: percent complete to date. */
    percentComplete: percentField.optional(),
    /** lump_sum by stages: the schedule (adds up to 100 %) and the indexes of the stages done. */
    stages: z.array(stageSchema).max(50).optional(),
    completedStages: z.array(z.number().int().min(0).max(49)).max(50).optional(),
    /** plan_quantity: the substantial error test (FDOT 9-3.2.1 defaults: 5 %, $5,000). */
    substantialErrorPercent: percentField.optional(),
    substantialErrorCents: centsField.optional(),
    /** lump_sum mobilization: steps tied to the percent of the original contract earned. */
    mobilizationSteps: z.array(stepSchema).max(20).optional(),
  })
  .strict();
export type ProfileSettings = z.infer<typeof profileSettingsSchema>;

/** The settings each profile reads; any other is refused by the server (a saved profile carries no stray term). */
export const PROFILE_SETTING_KEYS: Partial<Record<MeasurementProfile, readonly (keyof ProfileSettings)[]>> = {
  plan_quantity: ['percentComplete', 'substantialErrorPercent', 'substantialErrorCents'],
  lump_sum: ['percentComplete', 'stages', 'completedStages', 'mobilizationSteps'],
};

/**
 * The settings kept when an item's profile changes to `profile`: those the new profile reads, as they were (a
 * lump sum's stages and mobilization steps survive a save; a switch to a profile that does not read them drops them).
 */
export function settingsFor(profile: MeasurementProfile, settings: ProfileSettings): ProfileSettings {
  const keys = PROFILE_SETTING_KEYS[profile] ?? [];
  return Object.fromEntries(
    Object.entries(settings).filter(([k, v]) => v !== undefined && (keys as readonly string[]).includes(k)),
  ) as ProfileSettings;
}

export const setMeasurementProfileSchema = z
  .object({
    profile: z.enum(MEASUREMENT_PROFILES),
    payDecimals: z.number().int().min(0).max(MAX_PAY_DECIMALS).optional(),
    stage: z.enum(MEASUREMENT_STAGES).default('interim'),
    settings: profileSettingsSchema.default({}),
  })
  .strict();
export type SetMeasurementProfileInput = z.infer<typeof setMeasurementProfileSchema>;

export interface MeasurementProfileView {
  bidItemId: string;
  itemNumber: string;
  description: string;
  payUnit: string;
  profile: MeasurementProfile;
  profileLabel: string;
  payDecimals: number;
  measuredDecimals: number;
  stage: MeasurementStage;
  settings: ProfileSettings;
  /** True when the item has no saved profile (a worksheet at the unit's default). */
  isDefault: boolean;
  /** What the profile earns to date where it is computed from settings (plan quantity, lump sum), in cents. */
  earnedCents: number | null;
}

/**
 * The stage schedule of a lump-sum item, as its editor saves it: each stage's name, share of the lump sum and the
 * day it was done. The shares add up to exactly 100 % (to 0.01 %); the message names the sum so the editor can
 * show it beside the rows.
 */
export const setLumpSumStagesSchema = z
  .object({ stages: z.array(stageSchema).min(1, 'Add at least one stage').max(50, 'At most 50 stages') })
  .strict()
  .superRefine((v, ctx) => {
    const message = stageSumProblem(v.stages);
    if (message) ctx.addIssue({ code: 'custom', path: ['stages'], message });
  });

/** Why the shares of a stage schedule do not make 100 % (to 0.01 %), or null when they do; form and server alike. */
export function stageSumProblem(stages: readonly { percentOfItem: number }[]): string | null {
  const hundredths = stages.reduce((t, s) => t + Math.round(s.percentOfItem * 100), 0);
  return hundredths === 10_000 ? null : `The stages add up to ${hundredths / 100} %; they must add up to 100 %`;
}
export type SetLumpSumStagesInput = z.infer<typeof setLumpSumStagesSchema>;
