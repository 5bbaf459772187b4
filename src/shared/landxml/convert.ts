import type { LandXmlBoundary, LandXmlCrossSection, LandXmlSurface } from './reader';
import { factorTo, type LandXmlUnits } from './units';

/** Plan and elevation factors from the file's units to the worksheet's (ft = international foot, or m). */
export function unitFactors(units: LandXmlUnits, to: 'ft' | 'm'): { plan: number; elevation: number } {
  return { plan: factorTo(units.linearUnit, to), elevation: factorTo(units.elevationUnit, to) };
}

function scaled(values: Float64Array, k: number): Float64Array {
  if (k === 1) return values;
  const out = new Float64Array(values.length);
  for (let i = 0; i < values.length; i++) out[i] = values[i]! * k;
  return out;
}

/** A surface's points as x, y, z columns in the worksheet's unit (the same arrays when no factor applies). */
export function surfacePointsIn(
  surface: LandXmlSurface,
  units: LandXmlUnits,
  to: 'ft' | 'm',
): { x: Float64Array; y: Float64Array; z: Float64Array } {
  const k = unitFactors(units, to);
  return { x: scaled(surface.x, k.plan), y: scaled(surface.y, k.plan), z: scaled(surface.z, k.elevation) };
}

/** Breaklines in the worksheet's unit: plan by the linear unit, heights by the elevation unit. */
export function breaklinesIn(
  lines: readonly (readonly [number, number, number][])[],
  units: LandXmlUnits,
  to: 'ft' | 'm',
): [number, number, number][][] {
  const k = unitFactors(units, to);
  return lines.map((l) => l.map(([x, y, z]) => [x * k.plan, y * k.plan, z * k.elevation] as [number, number, number]));
}

/** Boundaries in the worksheet's unit. */
export function boundariesIn(
  boundaries: readonly LandXmlBoundary[],
  units: LandXmlUnits,
  to: 'ft' | 'm',
): LandXmlBoundary[] {
  const k = unitFactors(units, to).plan;
  return boundaries.map((b) => ({ ...b, ring: b.ring.map(([x, y]) => [x * k, y * k] as [number, number]) }));
}

/** Cross sections in the worksheet's unit: stations and offsets by the linear unit, elevations by their own. */
export function sectionsIn(
  sections: readonly LandXmlCrossSection[],
  units: LandXmlUnits,
  to: 'ft' | 'm',
): LandXmlCrossSection[] {
  const k = unitFactors(units, to);
  return sections.map((s) => ({
    ...s,
    station: s.station * k.plan,
    shownStation: s.shownStation * k.plan,
    surfaces: s.surfaces.map((line) => ({
      name: line.name,
      parts: line.parts.map((part) => part.map(([o, e]) => [o * k.plan, e * k.elevation] as [number, number])),
    })),
  }));
}
