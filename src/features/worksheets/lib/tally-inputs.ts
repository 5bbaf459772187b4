import type { MeasurementBasis, TallyComponent } from '@/shared/constants';

export type SplitTallyInputs = {
  /** The engine inputs alone (the calc API body), for the worksheet to start from. */
  inputs: Record<string, unknown> | null;
  component: TallyComponent | undefined;
  measuredBasis: MeasurementBasis | undefined;
  density: number | undefined;
};

/** A saved tally's inputs hold its billing options beside the engine inputs; the worksheet gets only the latter. */
export function splitTallyInputs(stored: Record<string, unknown> | null): SplitTallyInputs {
  if (!stored) return { inputs: null, component: undefined, measuredBasis: undefined, density: undefined };
  const { component, measuredBasis, density, ...inputs } = stored as {
    component?: TallyComponent;
    measuredBasis?: MeasurementBasis;
    density?: number;
  };
  return { inputs, component, measuredBasis, density };
}
