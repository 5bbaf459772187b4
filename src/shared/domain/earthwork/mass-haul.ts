import type { MassHaulFactorKind, ZeroAreaEndRule } from '../../constants';
import { DomainError, assertFinite, assertNonNegative } from '../domain-error';
import { lineAmountCents } from '../money';
import { endAreaPair, type StationInput } from './end-area-core';
import { regionLayers } from './mass-haul-layers';
import { massHaulTrail } from './mass-haul-trail';
import { cubicToVolume, volumeUnitOf, type LengthUnit, type VolumeUnit } from './units';

export interface MassHaulInput {
  unit: LengthUnit;
  /** Cross sections, as for end areas (sq ft or m2, stations in length units). */
  stations: readonly StationInput[];
  /** Fill turned into the bank volume it takes: shrinkage (earth) fill / (1 - p), swell (rock) fill / (1 + p). */
  factor?: { kind: MassHaulFactorKind; percent: number };
  /** Free haul distance, ft or m. */
  freeHaul: number;
  /** Ordinate of the balance line, CY or m3 (default 0). */
  balanceLine?: number;
  /** Length of one station, ft or m (default 100: station-yards, or station-m3 with 100 m stations). */
  stationLength?: number;
  /** Optional price per station-yard (or station-m3), integer cents. */
  overhaulPriceCents?: number;
  zeroAreaEnds?: ZeroAreaEndRule;
}

export interface MassOrdinate {
  station: number;
  /** Segment volumes ending at this station (0 at the first), CY or m3; fill before and after the factor. */
  cut: number;
  fill: number;
  adjustedFill: number;
  /** Running sum of cut - adjusted fill, bank measure. */
  ordinate: number;
}

export interface HaulLoop {
  from: number;
  to: number;
  /** forward: cut ahead of fill (material moves up-station); backward: the reverse. */
  direction: 'forward' | 'backward';
  volume: number;
  /** Volume x distance in station units (station-yards or station-m3). */
  haul: number;
  overhaulVolume: number;
  overhaul: number;
  /** Centre-to-centre haul distance (haul / volume), ft or m; null when nothing moves. */
  averageHaulDistance: number | null;
  /** Overhaul distance beyond free haul (overhaul / overhaul volume), ft or m. */
  averageOverhaulDistance: number | null;
}

export interface MassHaulResult {
  unit: LengthUnit;
  volumeUnit: VolumeUnit;
  overhaulUnit: 'station-yd' | 'station-m3';
  stationLength: number;
  freeHaul: number;
  balanceLine: number;
  /** Fill divisor: compacted volume one bank unit makes. */
  fillFactor: number;
  ordinates: MassOrdinate[];
  balancePoints: number[];
  loops: HaulLoop[];
  haul: number;
  overhaulVolume: number;
  overhaul: number;
  /** Unbalanced volumes at the ends of the profile (bank measure). */
  waste: number;
  borrow: number;
  /** Of waste and borrow: volume that comes in at the start and leaves at the end (layers open at both ends). */
  through: number;
  overhaulAmountCents: number | null;
  trail: string[];
}

function fillFactor(input: MassHaulInput): number {
  if (!input.factor) return 1;
  const p = input.factor.percent / 100;
  assertFinite(input.factor.percent, ['factor', 'percent']);
  const k = input.factor.kind === 'shrinkage' ? 1 - p : 1 + p;
  if (!(k > 0) || p < 0)
    throw new DomainError('INVALID_NUMBER', 'The factor percent must be 0 or more (shrinkage under 100)', [
      'factor',
      'percent',
    ]);
  return k;
}

function ordinatesOf(input: MassHaulInput, k: number): MassOrdinate[] {
  const { stations, unit } = input;
  const rule = input.zeroAreaEnds ?? 'average';
  const out: MassOrdinate[] = [{ station: stations[0]!.station, cut: 0, fill: 0, adjustedFill: 0, ordinate: 0 }];
  let m = 0;
  for (let i = 1; i < stations.length; i++) {
    const a = stations[i - 1]!;
    const b = stations[i]!;
    if (!(b.station > a.station))
      throw new DomainError('STATIONS_NOT_INCREASING', `Station ${i} must be beyond station ${i - 1}`, [
        'stations',
        i,
        'station',
      ]);
    const length = b.station - a.station;
    const cut = cubicToVolume(endAreaPair(a.cutArea, b.cutArea, length, rule), unit);
    const fill = cubicToVolume(endAreaPair(a.fillArea, b.fillArea, length, rule), unit);
    m += cut - fill / k;
    out.push({ station: b.station, cut, fill, adjustedFill: fill / k, ordinate: m });
  }
  return out;
}

/** Mass ordinates, balance points, haul and overhaul by the mass diagram (see mass-haul-layers.ts). */
export function massHaul(input: MassHaulInput): MassHaulResult {
  const { unit } = input;
  if (input.stations.length < 2)
    throw new DomainError('VALIDATION_FAILED', 'At least 2 stations are needed', ['stations']);
  input.stations.forEach((s, i) => {
    assertFinite(s.station, ['stations', i, 'station']);
    assertNonNegative(s.cutArea, ['stations', i, 'cutArea']);
    assertNonNegative(s.fillArea, ['stations', i, 'fillArea']);
  });
  assertNonNegative(input.freeHaul, ['freeHaul']);
  const stationLength = input.stationLength ?? 100;
  assertNonNegative(stationLength, ['stationLength'], true);
  const line = input.balanceLine ?? 0;
  assertFinite(line, ['balanceLine']);
  const k = fillFactor(input);
  const ordinates = ordinatesOf(input, k);
  const { loops, balancePoints, waste, borrow, through } = haulLoops(ordinates, line, input.freeHaul, stationLength);
  const haul = loops.reduce((s, l) => s + l.haul, 0);
  const overhaul = loops.reduce((s, l) => s + l.overhaul, 0);
  const overhaulVolume = loops.reduce((s, l) => s + l.overhaulVolume, 0);
  const price = input.overhaulPriceCents;
  const overhaulAmountCents = price === undefined ? null : lineAmountCents(overhaul, price, ['overhaulPriceCents']);
  const result: MassHaulResult = {
    unit,
    volumeUnit: volumeUnitOf(unit),
    overhaulUnit: unit === 'ft' ? 'station-yd' : 'station-m3',
    stationLength,
    freeHaul: input.freeHaul,
    balanceLine: line,
    fillFactor: k,
    ordinates,
    balancePoints,
    loops,
    haul,
    overhaulVolume,
    overhaul,
    waste,
    borrow,
    through,
    overhaulAmountCents,
    trail: [],
  };
  result.trail = massHaulTrail(result, input.factor);
  return result;
}

/** Splits the curve at the balance line into regions and integrates each by layers. */
function haulLoops(ordinates: readonly MassOrdinate[], line: number, freeHaul: number, stationLength: number) {
  const loops: HaulLoop[] = [];
  const balancePoints: number[] = [];
  let waste = 0;
  let borrow = 0;
  let through = 0;
  let xs: number[] = [];
  let gs: number[] = [];
  let sign = 0;
  const flush = () => {
    if (sign === 0 || xs.length < 2) return;
    const st = regionLayers(
      xs,
      gs.map((g) => g * sign),
      freeHaul,
    );
    const forward = sign > 0;
    // Layers open at the end: cut never used (forward) is waste, fill never supplied (backward) is borrow. A
    // layer open at both ends comes in at one end and leaves at the other: it is both borrow and waste.
    if (forward) {
      waste += st.openEnd;
      borrow += st.openStart;
    } else {
      borrow += st.openEnd;
      waste += st.openStart;
    }
    waste += st.openBoth;
    borrow += st.openBoth;
    through += st.openBoth;
    if (st.volume === 0) return;
    loops.push({
      from: xs[0]!,
      to: xs[xs.length - 1]!,
      direction: forward ? 'forward' : 'backward',
      volume: st.volume,
      haul: st.haul / stationLength,
      overhaulVolume: st.overhaulVolume,
      overhaul: st.overhaul / stationLength,
      averageHaulDistance: st.volume > 0 ? st.haul / st.volume : null,
      averageOverhaulDistance: st.overhaulVolume > 0 ? st.overhaul / st.overhaulVolume : null,
    });
  };
  for (let i = 0; i < ordinates.length; i++) {
    const x = ordinates[i]!.station;
    const g = ordinates[i]!.ordinate - line;
    const s = Math.sign(g);
    if (i > 0 && s !== 0 && sign !== 0 && s !== sign) {
      const px = xs[xs.length - 1]!;
      const pg = gs[gs.length - 1]!;
      const cx = px + (pg / (pg - g)) * (x - px);
      xs.push(cx);
      gs.push(0);
      balancePoints.push(cx);
      flush();
      xs = [cx];
      gs = [0];
    }
    xs.push(x);
    gs.push(g);
    if (s === 0 && i > 0 && i < ordinates.length - 1) {
      balancePoints.push(x);
      flush();
      xs = [x];
      gs = [0];
      sign = 0;
    } else if (s !== 0) sign = s;
  }
  flush();
  return { loops, balancePoints, waste, borrow, through };
}
