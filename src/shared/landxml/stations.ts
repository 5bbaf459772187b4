/**
 * Station equations (LandXML 1.2 StaEquation: staInternal, staAhead required; staBack; staIncrement). Stations in
 * the file (CrossSect@sta, Alignment@staStart) are internal stations, continuous along the line; an equation
 * restarts the station shown from staAhead at the internal station staInternal.
 */
export interface StationEquation {
  /** Internal station where the equation applies. */
  staInternal: number;
  /** Station shown ahead of the equation. */
  staAhead: number;
  /** Station shown back of the equation (informational), or null when not written. */
  staBack: number | null;
  /** Stations shown ahead increase (default) or decrease with the internal station. */
  increasing: boolean;
}

export interface ShownStation {
  /** The station as shown, equations applied. */
  station: number;
  /** 0 before the first equation, k after the k-th: tells apart repeated shown stations. */
  region: number;
}

/** The station shown at an internal station: the last equation at or before it applies. */
export function shownStation(equations: readonly StationEquation[], internal: number): ShownStation {
  let region = 0;
  let applied: StationEquation | null = null;
  const sorted = [...equations].sort((a, b) => a.staInternal - b.staInternal);
  sorted.forEach((eq, i) => {
    if (eq.staInternal <= internal) {
      applied = eq;
      region = i + 1;
    }
  });
  if (!applied) return { station: internal, region: 0 };
  const eq = applied as StationEquation;
  const along = internal - eq.staInternal;
  return { station: eq.staAhead + (eq.increasing ? along : -along), region };
}
