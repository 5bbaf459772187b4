import type { LengthUnit } from '@/shared/constants';
import { isDomainError } from '@/shared/domain/domain-error';
import { sectionAreas, type SectionResult } from '@/shared/domain/earthwork/section';
import { csvRows, readNumber, type FileIssue } from '../lib/csv';
import { readLandXml, sectionsIn } from '@/shared/landxml';

type Pt = [number, number];
/** `station` is continuous (lengths come from it); `shown` is the station with equations applied, when it differs. */
export type CrossSection = { station: number; line: number; ground: Pt[]; design: Pt[]; shown?: number };
export type WorkedSection = CrossSection & { result: SectionResult };

const GROUND = /^(ground|existing|eg|og|original)/i;
const DESIGN = /^(design|proposed|finish|fg|final|template)/i;

/** CSV rows of station, surface (ground or design), offset, elevation; a header row is skipped. */
export function readSectionCsv(text: string): { sections: CrossSection[]; issues: FileIssue[] } {
  const rows = csvRows(text);
  const body =
    rows[0] && readNumber(rows[0].cells[0] ?? '') === null && readNumber(rows[0].cells[2] ?? '') === null
      ? rows.slice(1)
      : rows;
  const byStation = new Map<number, CrossSection>();
  const issues: FileIssue[] = [];
  for (const { line, cells } of body) {
    if (issues.length >= 50) break;
    if (cells.length !== 4) {
      issues.push({
        line,
        column: '(row)',
        message: `Expected station, surface, offset, elevation; found ${cells.length} values`,
      });
      continue;
    }
    const [sta, surface, off, elev] = cells as [string, string, string, string];
    const station = readNumber(sta);
    const offset = readNumber(off);
    const elevation = readNumber(elev);
    const kind = GROUND.test(surface) ? 'ground' : DESIGN.test(surface) ? 'design' : null;
    if (station === null) issues.push({ line, column: 'station', message: `"${sta}" is not a station` });
    if (kind === null) issues.push({ line, column: 'surface', message: `"${surface}" is neither ground nor design` });
    if (offset === null) issues.push({ line, column: 'offset', message: `"${off}" is not a number` });
    if (elevation === null) issues.push({ line, column: 'elevation', message: `"${elev}" is not a number` });
    if (station === null || kind === null || offset === null || elevation === null) continue;
    const section = byStation.get(station) ?? { station, line, ground: [], design: [] };
    byStation.set(station, section);
    const points = section[kind];
    const last = points[points.length - 1];
    if (last && offset <= last[0])
      issues.push({
        line,
        column: 'offset',
        message: `Offsets must increase along the ${kind} line (${offset} after ${last[0]})`,
      });
    else points.push([offset, elevation]);
  }
  if (body.length === 0) issues.push({ line: 1, column: '(file)', message: 'No data rows' });
  return { sections: [...byStation.values()].sort((a, b) => a.station - b.station), issues };
}

/**
 * LandXML <CrossSect> elements (the streaming reader, src/shared/landxml): the ground and design lines by name, or
 * the first two in order, in the worksheet's unit. Stations stay internal (continuous) for lengths; the station
 * shown carries the alignment's equations. A line in more than one PntList2D has a gap: refused, since an end
 * area needs a continuous line.
 */
export function readSectionLandXml(
  xml: string,
  unit: LengthUnit = 'ft',
): { sections: CrossSection[]; issues: FileIssue[] } {
  const doc = readLandXml(xml);
  const issues: FileIssue[] = [...doc.issues];
  if (issues.length > 0) return { sections: [], issues };
  if (doc.crossSections.length === 0)
    return { sections: [], issues: [{ line: 0, column: '(file)', message: 'No <CrossSect> found' }] };
  const out: CrossSection[] = [];
  for (const s of sectionsIn(doc.crossSections, doc.units, unit)) {
    const where = `<CrossSect sta="${s.station}">`;
    const ground = s.surfaces.find((x) => GROUND.test(x.name)) ?? s.surfaces.find((x) => !DESIGN.test(x.name));
    const design = s.surfaces.find((x) => DESIGN.test(x.name)) ?? s.surfaces.find((x) => x !== ground);
    if (!ground || !design) {
      issues.push({ line: s.line, column: where, message: 'Needs two <CrossSectSurf>: the ground and the design' });
      continue;
    }
    const gap = [ground, design].find((l) => l.parts.length > 1);
    if (gap) {
      const a = gap.parts[0]!.at(-1)?.[0];
      const b = gap.parts[1]!.at(0)?.[0];
      issues.push({
        line: s.line,
        column: `${where} ${gap.name}`,
        message: `The line has a gap (offsets ${a} to ${b}): an end area needs a continuous line`,
      });
      continue;
    }
    out.push({
      station: s.station,
      line: s.line,
      ground: ground.parts[0] ?? [],
      design: design.parts[0] ?? [],
      ...(s.shownStation !== s.station ? { shown: s.shownStation } : {}),
    });
  }
  return { sections: out.sort((a, b) => a.station - b.station), issues };
}

/** Cut and fill areas of each section by the shared engine; a section it refuses is reported, not dropped. */
export function workSections(sections: readonly CrossSection[], unit: LengthUnit) {
  const worked: WorkedSection[] = [];
  const issues: FileIssue[] = [];
  for (const s of sections) {
    try {
      worked.push({ ...s, result: sectionAreas({ unit, ground: s.ground, design: s.design }) });
    } catch (error) {
      const message = isDomainError(error) ? error.message : String(error);
      issues.push({ line: s.line, column: `station ${s.station}`, message });
    }
  }
  return { worked, issues };
}

export function readSections(text: string, unit: LengthUnit) {
  const read = text.trimStart().startsWith('<') ? readSectionLandXml(text, unit) : readSectionCsv(text);
  const { worked, issues } = workSections(read.sections, unit);
  return { worked, issues: [...read.issues, ...issues] };
}

/** Invented sections of a pad access road: the ground rises along the line, so fill gives way to cut. */
export function sampleSectionCsv(unit: LengthUnit): string {
  const k = unit === 'ft' ? 1 : 0.3;
  const rows = ['station,surface,offset,elevation'];
  const start = unit === 'ft' ? 1000 : 300;
  for (let i = 0; i < 5; i++) {
    const station = start + i * 50 * k;
    for (const o of [-40, -20, 0, 20, 40]) {
      const g = 99.4 + 1.1 * i - 0.04 * o + 0.5 * Math.sin(o / 15 + i);
      rows.push(`${station},ground,${(o * k).toFixed(2)},${(g * k).toFixed(2)}`);
    }
    for (const [o, e] of [
      [-40, 99.5],
      [-16, 101.5],
      [16, 101.5],
      [40, 99.5],
    ] as const)
      rows.push(`${station},design,${(o * k).toFixed(2)},${(e * k).toFixed(2)}`);
  }
  return rows.join('\n');
}
