import type { MassHaulInput, MassHaulResult } from './mass-haul';
import { fmt, fmtVolume, listSome } from './trail';
import { formatStation } from './units';

export function massHaulTrail(r: MassHaulResult, factor: MassHaulInput['factor']): string[] {
  const u = r.unit;
  const ou = r.overhaulUnit;
  const lines = [
    'Segment volumes by average end area; mass ordinate = running sum of cut (+) and fill (-) (US Navy Engineering Aid, Table 10-2)',
    factor
      ? `Fill divided by ${fmt(r.fillFactor, 4)} (${factor.kind} ${fmt(factor.percent, 2)} %) so the ordinates are in bank measure`
      : 'No shrink or swell factor: fill taken as bank measure',
    `Balance line at ${fmtVolume(r.balanceLine, u)}; balance points at ${
      r.balancePoints.length === 0
        ? 'none'
        : r.balancePoints
            .slice(0, 12)
            .map((x) => formatStation(x, u))
            .join(', ')
    }${r.balancePoints.length > 12 ? ' ...' : ''}`,
    `Free haul ${fmt(r.freeHaul)} ${u}; overhaul = volume x (haul distance - free haul), layer by layer, in ${ou} (${fmt(r.stationLength, 0)} ${u} stations; UFGS 02300)`,
    ...listSome(
      r.loops,
      10,
      (l) =>
        `${l.direction === 'forward' ? 'Forward' : 'Backward'} loop ${formatStation(l.from, u)} to ${formatStation(l.to, u)}: ${fmtVolume(l.volume, u)} moved ${l.averageHaulDistance === null ? '-' : fmt(l.averageHaulDistance)} ${u} centre to centre; overhaul ${fmtVolume(l.overhaulVolume, u)} x ${l.averageOverhaulDistance === null ? '0' : fmt(l.averageOverhaulDistance)} ${u} = ${fmt(l.overhaul)} ${ou}`,
    ),
    `Total haul ${fmt(r.haul)} ${ou}; overhaul ${fmt(r.overhaul)} ${ou}; unbalanced at the ends: waste ${fmtVolume(r.waste, u)}, borrow ${fmtVolume(r.borrow, u)}`,
  ];
  if (r.through > 0) {
    lines.push(
      `${fmtVolume(r.through, u)} of that comes in at the start and leaves at the end (the curve stays off the balance line at both ends): counted in both borrow and waste`,
    );
  }
  if (r.overhaulAmountCents !== null)
    lines.push(
      `Overhaul amount = ${fmt(r.overhaul)} ${ou} x unit price = $${fmt(r.overhaulAmountCents / 100)} (rounded once to the cent)`,
    );
  return lines;
}
