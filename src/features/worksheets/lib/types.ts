import type { LengthUnit } from '@/shared/constants';

/** The eight worksheets, in the order the picker lists them. */
export const WORKSHEET_METHODS = ['end-area', 'grid', 'pit', 'trench', 'load-count', 'spoil', 'surface', 'mass-haul'] as const;
export type WorksheetMethod = (typeof WORKSHEET_METHODS)[number];

/**
 * Worksheets whose result the tallies API bills (server/modules/tallies/worksheet-engine.ts). Spoil and mass haul
 * are planners there; surface to surface is not yet accepted by it.
 */
export const SAVEABLE_METHODS: ReadonlySet<WorksheetMethod> = new Set(['end-area', 'grid', 'pit', 'trench', 'load-count']);

/** Worksheets with both cut and fill, where a tally bills one of them. */
export const CUT_FILL_METHODS: ReadonlySet<WorksheetMethod> = new Set(['end-area', 'grid', 'surface']);

export type WorksheetProps = {
  unit: LengthUnit;
  /** A saved tally's inputs to start from, or null for the sample. */
  initial: Record<string, unknown> | null;
  /** The project's default material factors. */
  defaults: { swellPercent: number; shrinkagePercent: number };
  /** Called with the engine inputs whenever they give a result, and null while they do not. */
  onInputs: (inputs: Record<string, unknown> | null) => void;
};
