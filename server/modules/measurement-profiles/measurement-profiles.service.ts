import {
  PROFILE_SETTING_KEYS,
  type MeasurementProfileView,
  type ProfileSettings,
  type SetLumpSumStagesInput,
  type SetMeasurementProfileInput,
} from '../../../src/shared/schemas/provisions/profile';
import { checkStageSchedule } from '../../../src/shared/domain/provisions/lump-sum';
import { checkMobilizationSteps } from '../../../src/shared/domain/provisions/mobilization';
import { precisionFor } from '../../../src/shared/domain/provisions/precision';
import { MEASUREMENT_PROFILE_LABELS, type PayUnit } from '../../../src/shared/constants';
import type { Db } from '../../db/client';
import type { Actor } from '../../lib/actor';
import { conflict, notFound, validationFailed } from '../../lib/app-error';
import { findBidItem } from '../bid-items/bid-items.repository';
import { loadProjectAccess, isUuid } from '../projects/project-access';
import { canSetMeasurementProfile } from '../../../src/shared/policies/field-records';
import { asAppError, recordChange } from '../field-records/record-change';
import { presentProfile } from './measurement-profiles.presenter';
import * as repo from './measurement-profiles.repository';

export async function listProfiles(db: Db, actor: Actor, projectId: string): Promise<MeasurementProfileView[]> {
  await loadProjectAccess(db, actor, projectId);
  const rows = await repo.listItemsWithProfiles(db, projectId);
  return rows.map((r) => presentProfile(r.item, r.profile));
}

/** Settings that belong to another profile are refused, so a saved profile never carries a stray term. */
function checkSettings(input: SetMeasurementProfileInput, unit: PayUnit) {
  const s = input.settings;
  const ok: readonly (keyof typeof s)[] = PROFILE_SETTING_KEYS[input.profile] ?? [];
  const stray = (Object.keys(s) as (keyof typeof s)[]).filter((k) => s[k] !== undefined && !ok.includes(k));
  if (stray.length > 0) {
    throw validationFailed(
      stray.map((k) => ({ path: `settings.${k}`, message: `Not a setting of the ${input.profile} profile` })),
    );
  }
  if (input.profile === 'lump_sum' && unit !== 'LS') {
    throw validationFailed([{ path: 'profile', message: 'A lump-sum profile needs an item paid in LS' }]);
  }
  if (s.stages && s.stages.length > 0) checkStageSchedule(s.stages);
  if (s.stages && s.percentComplete !== undefined) {
    throw validationFailed([
      { path: 'settings.percentComplete', message: 'With a stage schedule the stages done say the percent' },
    ]);
  }
  for (const [i, index] of (s.completedStages ?? []).entries()) {
    if (index >= (s.stages?.length ?? 0)) {
      throw validationFailed([
        { path: `settings.completedStages.${i}`, message: `No stage ${index + 1} in the schedule` },
      ]);
    }
  }
  if (s.mobilizationSteps) checkMobilizationSteps(s.mobilizationSteps);
}

export async function setProfile(db: Db, actor: Actor, bidItemId: string, input: SetMeasurementProfileInput) {
  const item = isUuid(bidItemId) ? await findBidItem(db, bidItemId) : undefined;
  if (!item) throw notFound('The bid item');
  const unit = item.payUnit as PayUnit;
  return recordChange(
    db,
    actor,
    item.projectId,
    canSetMeasurementProfile,
    { objectType: 'bid_item', action: 'measurement_profile.set', notFoundAs: 'The bid item' },
    async (tx) => {
      const payDecimals = await asAppError(() => {
        checkSettings(input, unit);
        return precisionFor(unit, input.payDecimals).payDecimals;
      }, 'settings.');
      const before = await repo.findProfile(tx, item.id);
      const row = await repo.upsertProfile(tx, {
        bidItemId: item.id,
        projectId: item.projectId,
        profile: input.profile,
        payDecimals,
        stage: input.stage,
        settings: input.settings,
      });
      const view = presentProfile(item, row);
      const pick = (r: repo.BidItemProfileRow | undefined) =>
        r && { profile: r.profile, payDecimals: r.payDecimals, stage: r.stage, settings: r.settings };
      return { id: item.id, before: pick(before) ?? null, after: pick(row), value: view };
    },
  );
}

/**
 * Saves a lump-sum item's stage schedule (name, share, day done), replacing any percent complete or older list of
 * stages done; mobilization steps are kept. The shares were checked to add up to 100 % by the request schema; a
 * stage cannot be done on a day still to come. One transaction, one `lump_sum_stages.set` event.
 */
export async function setStages(db: Db, actor: Actor, bidItemId: string, input: SetLumpSumStagesInput) {
  const item = isUuid(bidItemId) ? await findBidItem(db, bidItemId) : undefined;
  if (!item) throw notFound('The bid item');
  const today = new Date().toISOString().slice(0, 10);
  const future = input.stages.flatMap((s, i) =>
    s.completedOn && s.completedOn > today
      ? [{ path: `stages.${i}.completedOn`, message: `A stage cannot be done after today (${today})` }]
      : [],
  );
  return recordChange(
    db,
    actor,
    item.projectId,
    canSetMeasurementProfile,
    { objectType: 'bid_item', action: 'lump_sum_stages.set', notFoundAs: 'The bid item' },
    async (tx) => {
      const before = await repo.findProfile(tx, item.id);
      if (before?.profile !== 'lump_sum') {
        const paidBy = MEASUREMENT_PROFILE_LABELS[before?.profile ?? 'worksheet'].toLowerCase();
        throw conflict(
          'PROFILE_MISMATCH',
          `Item ${item.itemNumber} is paid by ${paidBy}; a stage schedule needs the lump-sum profile first.`,
        );
      }
      if (future.length > 0) throw validationFailed(future);
      const old = before.settings as ProfileSettings;
      const stages = input.stages.map((s) => ({ ...s, completedOn: s.completedOn ?? null }));
      const settings: ProfileSettings = {
        stages,
        ...(old.mobilizationSteps ? { mobilizationSteps: old.mobilizationSteps } : {}),
      };
      const row = await repo.upsertProfile(tx, {
        bidItemId: item.id,
        projectId: item.projectId,
        profile: before.profile,
        payDecimals: before.payDecimals,
        stage: before.stage,
        settings,
      });
      return {
        id: item.id,
        before: { stages: old.stages ?? [], completedStages: old.completedStages ?? [] },
        after: { stages },
        value: presentProfile(item, row),
      };
    },
  );
}
