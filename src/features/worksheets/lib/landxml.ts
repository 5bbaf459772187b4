import { XMLParser, XMLValidator } from 'fast-xml-parser';
import type { FileIssue } from './csv';

/** LandXML (the open standard) surfaces and cross sections, read into the engine's plain numbers. */
export type LandXmlSurface = { name: string; points: [number, number, number][] };
export type LandXmlSection = { station: number; surfaces: { name: string; points: [number, number][] }[] };

const ARRAYS = new Set(['Surface', 'P', 'CrossSect', 'CrossSectSurf', 'CrossSects', 'Alignment']);
const parser = new XMLParser({
  ignoreAttributes: false,
  attributeNamePrefix: '@_',
  removeNSPrefix: true,
  parseTagValue: false,
  isArray: (name) => ARRAYS.has(name),
});

type Node = Record<string, unknown>;

function children(node: unknown, name: string): Node[] {
  if (!node || typeof node !== 'object') return [];
  const value = (node as Node)[name];
  return Array.isArray(value) ? (value as Node[]) : value && typeof value === 'object' ? [value as Node] : [];
}

function text(node: unknown): string {
  if (typeof node === 'string') return node;
  if (node && typeof node === 'object' && '#text' in node) return String((node as Node)['#text']);
  return '';
}

function numbers(raw: string): number[] {
  return raw.trim() === '' ? [] : raw.trim().split(/[\s,]+/).map(Number);
}

function parseDocument(xml: string): { root: Node | null; issues: FileIssue[] } {
  const valid = XMLValidator.validate(xml);
  if (valid !== true) {
    return { root: null, issues: [{ line: valid.err.line, column: `column ${valid.err.col}`, message: valid.err.msg }] };
  }
  const doc = parser.parse(xml) as Node;
  const root = doc.LandXML as Node | undefined;
  if (!root) return { root: null, issues: [{ line: 1, column: '(file)', message: 'Not a LandXML file: no <LandXML> root element' }] };
  return { root, issues: [] };
}

/**
 * <Surfaces><Surface name><Definition><Pnts><P id>northing easting elevation</P>. LandXML writes northing first;
 * the points come back as [x = easting, y = northing, z].
 */
export function readLandXmlSurfaces(xml: string, maxIssues = 50): { surfaces: LandXmlSurface[]; issues: FileIssue[] } {
  const { root, issues } = parseDocument(xml);
  if (!root) return { surfaces: [], issues };
  const surfaces: LandXmlSurface[] = [];
  for (const group of children(root, 'Surfaces')) {
    for (const surface of children(group, 'Surface')) {
      const name = String(surface['@_name'] ?? `Surface ${surfaces.length + 1}`);
      const points: [number, number, number][] = [];
      for (const pnts of children(surface.Definition, 'Pnts')) {
        for (const p of children(pnts, 'P')) {
          const v = numbers(text(p));
          if (v.length !== 3 || v.some((n) => !Number.isFinite(n))) {
            if (issues.length < maxIssues) {
              issues.push({ line: 0, column: `${name}, <P id="${String(p['@_id'] ?? '?')}">`, message: `Expected "northing easting elevation", found "${text(p).trim()}"` });
            }
            continue;
          }
          points.push([v[1]!, v[0]!, v[2]!]);
        }
      }
      surfaces.push({ name, points });
    }
  }
  if (surfaces.length === 0 && issues.length === 0) issues.push({ line: 0, column: '(file)', message: 'No <Surface> with <Pnts> found' });
  return { surfaces, issues };
}

/** <CrossSects><CrossSect sta><CrossSectSurf name><PntList2D>offset elev offset elev ...</PntList2D>. */
export function readLandXmlSections(xml: string, maxIssues = 50): { sections: LandXmlSection[]; issues: FileIssue[] } {
  const { root, issues } = parseDocument(xml);
  if (!root) return { sections: [], issues };
  const sections: LandXmlSection[] = [];
  const holders = [root, ...children(root, 'Alignments').flatMap((a) => children(a, 'Alignment'))];
  for (const holder of holders) {
    for (const group of children(holder, 'CrossSects')) {
      for (const cs of children(group, 'CrossSect')) {
        const station = Number(cs['@_sta']);
        const where = `<CrossSect sta="${String(cs['@_sta'] ?? '')}">`;
        if (!Number.isFinite(station)) {
          if (issues.length < maxIssues) issues.push({ line: 0, column: where, message: 'The sta attribute is not a number' });
          continue;
        }
        const surfaces = children(cs, 'CrossSectSurf').map((s) => {
          const name = String(s['@_name'] ?? '');
          const v = numbers(text(s.PntList2D));
          if (v.length % 2 !== 0 || v.some((n) => !Number.isFinite(n))) {
            if (issues.length < maxIssues) issues.push({ line: 0, column: `${where} ${name}`, message: 'PntList2D must be pairs of numbers: offset elevation' });
            return { name, points: [] };
          }
          const points: [number, number][] = [];
          for (let i = 0; i < v.length; i += 2) points.push([v[i]!, v[i + 1]!]);
          return { name, points };
        });
        sections.push({ station, surfaces });
      }
    }
  }
  if (sections.length === 0 && issues.length === 0) issues.push({ line: 0, column: '(file)', message: 'No <CrossSect> found' });
  return { sections, issues };
}
