import type { MeasurementMethod, TallyStatus } from '@/shared/constants';

export const TALLY_STATUS_LABELS: Record<TallyStatus, string> = {
  draft: 'Draft',
  ready: 'Ready to bill',
  billed: 'Billed',
};
export const TALLY_STATUS_TONES: Record<TallyStatus, 'neutral' | 'clay' | 'spruce'> = {
  draft: 'neutral',
  ready: 'clay',
  billed: 'spruce',
};

/** Methods a tally can be computed with (the spoil planner and mass haul do not measure a pay quantity). */
export const TALLY_METHODS = [
  'end-area',
  'grid',
  'pit',
  'trench',
  'load-count',
  'surface',
  'manual',
] as const satisfies readonly MeasurementMethod[];

/** A starting point for each worksheet's inputs (the calc API body); numbers of our own. */
export const EXAMPLE_INPUTS: Partial<Record<MeasurementMethod, object>> = {
  'end-area': {
    unit: 'ft',
    stations: [
      { station: 1200, cutArea: 48.5, fillArea: 0 },
      { station: 1250, cutArea: 61.2, fillArea: 0 },
      { station: 1300, cutArea: 55, fillArea: 3.4 },
    ],
  },
  grid: {
    unit: 'ft',
    spacingX: 25,
    spacingY: 25,
    depths: [
      [0.8, 1.2, 1.6],
      [1.1, 1.9, 2.2],
      [1.4, 2.1, 2.6],
    ],
  },
  pit: { unit: 'ft', length: 60, width: 40, cornerDepths: [6.2, 5.8, 7.1, 6.6], sideSlope: 0 },
  trench: { unit: 'ft', protection: 'box', runs: [{ length: 180, depth: 7.5, bottomWidth: 4 }] },
  'load-count': { swellPercent: 25, loads: [{ capacity: 14, count: 36 }] },
  surface: {
    unit: 'ft',
    existing: [
      [0, 0, 100],
      [50, 0, 101],
      [0, 50, 100.5],
      [50, 50, 102],
    ],
    design: [
      [0, 0, 99],
      [50, 0, 99],
      [0, 50, 99],
      [50, 50, 99],
    ],
  },
};
