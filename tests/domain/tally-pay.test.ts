import { describe, expect, it } from 'vitest';
import { paySourceOf, talliesNotBilledReason } from '../../src/shared/domain/provisions/tally-pay';

// The rule of pay application compilation (server/modules/pay-apps/pay-app-build.ts), said for the screens:
// which items are paid from something other than their tallies. Truck measure and weight from tickets (a state
// DOT construction manual, sections 109.11-109.12); the rest as the project's settings say (common practice).
describe('when an item’s tallies are not what it is paid from', () => {
  it('tickets pay truck-measure and weight items', () => {
    expect(talliesNotBilledReason('truck_measure', {})).toMatch(/Counted loads \(truck register\)/);
    expect(talliesNotBilledReason('weight', {})).toMatch(/Weighed \(scale tickets\)/);
  });

  it('settings pay a plan quantity or a lump sum only once they give a quantity', () => {
    expect(talliesNotBilledReason('plan_quantity', {})).toBeNull();
    expect(talliesNotBilledReason('plan_quantity', { percentComplete: 40 })).not.toBeNull();
    expect(talliesNotBilledReason('lump_sum', {})).toBeNull();
    expect(talliesNotBilledReason('lump_sum', { percentComplete: 0 })).not.toBeNull();
    expect(talliesNotBilledReason('lump_sum', { mobilizationSteps: [{ percentOfItem: 50 }] })).not.toBeNull();
  });

  it('tallies pay an item measured by worksheet or with no profile', () => {
    expect(talliesNotBilledReason(null, {})).toBeNull();
    expect(talliesNotBilledReason('worksheet', {})).toBeNull();
  });

  it('signed daily sheets, not tallies, pay an item on force account (MoDOT EPG 109.5)', () => {
    // A tally for it would bill the same work a second time beside the days drawn on it.
    expect(talliesNotBilledReason('force_account', {})).toMatch(/Time and materials \(force account\)/);
  });
});

describe('what a pay line is paid from', () => {
  it('names the record each profile is paid from, and the reason agrees with it', () => {
    const cases = [
      [null, {}, 'tallies'],
      ['worksheet', {}, 'tallies'],
      ['force_account', {}, 'days'],
      ['plan_quantity', {}, 'tallies'],
      ['plan_quantity', { percentComplete: 40 }, 'settings'],
      ['lump_sum', { percentComplete: 0 }, 'settings'],
      ['lump_sum', { stages: [{ name: 'Pad', percentOfItem: 100 }] }, 'settings'],
      ['lump_sum', { mobilizationSteps: [{ percentOfItem: 50 }], percentComplete: 10 }, 'steps'],
      ['truck_measure', {}, 'tickets'],
      ['weight', { percentComplete: 10 }, 'tickets'],
      // A percent out of range cannot give a quantity; the item still leaves its tallies (compilation refuses it).
      ['plan_quantity', { percentComplete: 140 }, 'settings'],
    ] as const;
    for (const [profile, settings, source] of cases) {
      expect(paySourceOf(profile, settings)).toBe(source);
      expect(talliesNotBilledReason(profile, settings) === null).toBe(source === 'tallies');
    }
  });
});
