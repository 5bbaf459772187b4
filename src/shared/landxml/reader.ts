import { SaxesParser, type SaxesTagPlain } from 'saxes';
import { FloatColumn, IndexColumn, numbersOf, scanIds, scanNumbers } from './columns';
import { shownStation, type StationEquation } from './stations';
import { isLengthUnit, type LandXmlUnits } from './units';

/** A problem in the file: the line (1-based; 0 when not known), where in the file, and why. */
export type LandXmlIssue = { line: number; column: string; message: string };

/** A surface boundary in plan (x = easting, y = northing, the file's linear unit), from SourceData/Boundaries. */
export interface LandXmlBoundary {
  name: string;
  /** bndType as written: outer, void, island (schema enumeration). */
  kind: string;
  ring: [number, number][];
}

/**
 * One Surfaces/Surface. Points as columns: x = easting, y = northing (the file writes northing first), z =
 * elevation, in the file's units (linear for x and y, elevation for z; see LandXmlUnits). Faces as given, three
 * point indices each (a grid face of four is split along its first diagonal); invisible faces (i="1") left out.
 */
export interface LandXmlSurface {
  name: string;
  surfType: string | null;
  x: Float64Array;
  y: Float64Array;
  z: Float64Array;
  faces: Uint32Array;
  invisibleFaces: number;
  boundaries: LandXmlBoundary[];
  /** SourceData/Breaklines: polylines of [x = easting, y = northing, z] (PntList3D), the file's units. */
  breaklines: [number, number, number][][];
}

export interface LandXmlAlignment {
  name: string;
  /** Internal station at the start of the line. */
  staStart: number;
  length: number | null;
  equations: StationEquation[];
}

/** One line of a cross section: its parts in order; more than one part means a gap between them. */
export interface LandXmlSectionLine {
  name: string;
  /** [offset, elevation] pairs per PntList2D. */
  parts: [number, number][][];
}

export interface LandXmlCrossSection {
  /** The alignment the section belongs to, or null for CrossSects outside an Alignment. */
  alignment: string | null;
  /** Internal station (CrossSect@sta), the file's linear unit. */
  station: number;
  /** The station shown, with the alignment's station equations applied. */
  shownStation: number;
  /** 0 before the alignment's first equation, k after the k-th. */
  stationRegion: number;
  line: number;
  surfaces: LandXmlSectionLine[];
}

export interface LandXmlDocument {
  units: LandXmlUnits;
  surfaces: LandXmlSurface[];
  alignments: LandXmlAlignment[];
  crossSections: LandXmlCrossSection[];
  /** Empty when the whole file was read; otherwise nothing of it should be used. */
  issues: LandXmlIssue[];
}

export interface LandXmlReadOptions {
  /** Issues listed at most (default 50); reading stops at the first malformed XML. */
  maxIssues?: number;
}

const localName = (name: string) => {
  const colon = name.indexOf(':');
  return colon < 0 ? name : name.slice(colon + 1);
};

interface SurfaceBuild {
  name: string;
  surfType: string | null;
  x: FloatColumn;
  y: FloatColumn;
  z: FloatColumn;
  faces: IndexColumn;
  invisibleFaces: number;
  boundaries: LandXmlBoundary[];
  breaklines: [number, number, number][][];
  /** Point ids 1, 2, 3... in order need no map; the map is built at the first id that breaks the run. */
  ids: Map<string, number> | null;
}

/**
 * A streaming reader of LandXML 1.2 (saxes, a SAX parser: no document tree, so a million points cost their
 * numbers only). Feed text in pieces with write() and finish with close(). Reads Units, Surfaces (points, faces,
 * boundaries, breaklines), Alignments (staStart, length, StaEquation) and CrossSects; everything else is skipped.
 */
export class LandXmlReader {
  private readonly parser = new SaxesParser<{ xmlns: false; position: true }>({ xmlns: false, position: true });
  private readonly maxIssues: number;
  private readonly issues: LandXmlIssue[] = [];
  private readonly stack: string[] = [];
  private units: LandXmlUnits = {
    system: null,
    linearUnit: 'meter',
    elevationUnit: 'meter',
    elevationUnitDefaulted: true,
  };
  private readonly surfaces: LandXmlSurface[] = [];
  private readonly alignments: LandXmlAlignment[] = [];
  private readonly sections: LandXmlCrossSection[] = [];
  private surface: SurfaceBuild | null = null;
  private alignment: LandXmlAlignment | null = null;
  private section: LandXmlCrossSection | null = null;
  private sectionLine: LandXmlSectionLine | null = null;
  private boundary: LandXmlBoundary | null = null;
  private breakline: string | null = null;
  private text: string | null = null;
  private textLine = 0;
  private pointId = '';
  private faceInvisible = false;
  private sawRoot = false;
  private readonly scratch = new Float64Array(4);
  private readonly faceIndex = new Int32Array(4);
  private stopped = false;

  constructor(options: LandXmlReadOptions = {}) {
    this.maxIssues = options.maxIssues ?? 50;
    this.parser.on('opentag', (tag) => this.open(tag));
    this.parser.on('closetag', (tag) => this.close(tag));
    this.parser.on('text', (t) => {
      if (this.text !== null) this.text += t;
    });
    this.parser.on('cdata', (t) => {
      if (this.text !== null) this.text += t;
    });
    this.parser.on('error', (error) => {
      this.issue(this.parser.line, '(XML)', `Not well-formed XML: ${error.message.replace(/^[^:]*:\d+:\d+: /, '')}`);
      this.stopped = true;
      throw error;
    });
  }

  /** Feeds the next piece of the file. */
  write(chunk: string): this {
    if (this.stopped) return this;
    try {
      this.parser.write(chunk);
    } catch {
      this.stopped = true;
    }
    return this;
  }

  /** Ends the file and answers what was read. */
  end(): LandXmlDocument {
    if (!this.stopped) {
      try {
        this.parser.close();
      } catch {
        this.stopped = true;
      }
    }
    if (!this.sawRoot && this.issues.length === 0)
      this.issue(1, '(file)', 'Not a LandXML file: no <LandXML> root element');
    for (const s of this.sections) {
      const line = this.alignments.find((a) => a.name === s.alignment);
      const shown = shownStation(line?.equations ?? [], s.station);
      s.shownStation = shown.station;
      s.stationRegion = shown.region;
    }
    return {
      units: this.units,
      surfaces: this.surfaces,
      alignments: this.alignments,
      crossSections: this.sections,
      issues: this.issues,
    };
  }

  private issue(line: number, column: string, message: string): void {
    if (this.issues.length < this.maxIssues) this.issues.push({ line, column, message });
  }

  private parent(): string | undefined {
    return this.stack[this.stack.length - 1];
  }

  private collect(): void {
    this.text = '';
    this.textLine = this.parser.line;
  }

  private open(tag: SaxesTagPlain): void {
    const name = localName(tag.name);
    const a = tag.attributes;
    const parent = this.parent();
    this.stack.push(name);
    if (this.stack.length === 1) {
      if (name !== 'LandXML') {
        this.issue(this.parser.line, '(file)', `Not a LandXML file: the root element is <${tag.name}>`);
        this.stopped = true;
        throw new Error('not LandXML');
      }
      this.sawRoot = true;
      return;
    }
    switch (name) {
      case 'Metric':
      case 'Imperial':
        if (parent === 'Units') this.readUnits(name, a);
        return;
      case 'Surface':
        if (parent === 'Surfaces') this.startSurface(a.name);
        return;
      case 'Definition':
        if (this.surface && parent === 'Surface') this.surface.surfType = a.surfType ?? null;
        return;
      case 'P':
        if (this.surface && parent === 'Pnts' && this.stack.includes('Definition')) {
          this.pointId = a.id ?? '';
          this.collect();
        }
        return;
      case 'F':
        if (this.surface && parent === 'Faces') {
          this.faceInvisible = a.i === '1';
          this.collect();
        }
        return;
      case 'Boundary':
        if (this.surface && parent === 'Boundaries')
          this.boundary = { name: a.name ?? '', kind: a.bndType ?? 'outer', ring: [] };
        return;
      case 'Breakline':
        if (this.surface && parent === 'Breaklines')
          this.breakline = a.name ?? `Breakline ${this.surface.breaklines.length + 1}`;
        return;
      case 'PntList2D':
      case 'PntList3D':
        if (
          (this.boundary && parent === 'Boundary') ||
          (this.sectionLine && parent === 'CrossSectSurf') ||
          (this.breakline !== null && parent === 'Breakline')
        )
          this.collect();
        return;
      case 'Alignment':
        if (parent === 'Alignments') this.startAlignment(a);
        return;
      case 'StaEquation':
        if (this.alignment && parent === 'Alignment') this.addEquation(a);
        return;
      case 'CrossSect':
        if (parent === 'CrossSects') this.startSection(a);
        return;
      case 'CrossSectSurf':
        if (this.section && parent === 'CrossSect') this.sectionLine = { name: a.name ?? '', parts: [] };
        return;
    }
  }

  private close(tag: SaxesTagPlain): void {
    const name = localName(tag.name);
    this.stack.pop();
    const text = this.text;
    switch (name) {
      case 'P':
        if (text !== null && this.surface) this.addPoint(text);
        break;
      case 'F':
        if (text !== null && this.surface) this.addFace(text);
        break;
      case 'PntList2D':
      case 'PntList3D':
        if (text !== null) this.addList(name === 'PntList3D' ? 3 : 2, text);
        break;
      case 'Boundary':
        if (this.surface && this.boundary) this.surface.boundaries.push(this.boundary);
        this.boundary = null;
        break;
      case 'Breakline':
        this.breakline = null;
        break;
      case 'Surface':
        if (this.surface) this.finishSurface(this.surface);
        this.surface = null;
        break;
      case 'CrossSectSurf':
        if (this.section && this.sectionLine) this.section.surfaces.push(this.sectionLine);
        this.sectionLine = null;
        break;
      case 'CrossSect':
        if (this.section) this.sections.push(this.section);
        this.section = null;
        break;
      case 'Alignment':
        if (this.alignment) this.alignments.push(this.alignment);
        this.alignment = null;
        break;
    }
    this.text = null;
  }

  private readUnits(system: 'Metric' | 'Imperial', a: Record<string, string>): void {
    const linear = a.linearUnit ?? (system === 'Metric' ? 'meter' : 'foot');
    const elevation = a.elevationUnit ?? 'meter';
    for (const [field, value] of [
      ['linearUnit', linear],
      ['elevationUnit', elevation],
    ] as const) {
      if (!isLengthUnit(value)) this.issue(this.parser.line, `<${system} ${field}>`, `Unknown length unit "${value}"`);
    }
    if (!isLengthUnit(linear) || !isLengthUnit(elevation)) return;
    this.units = {
      system,
      linearUnit: linear,
      elevationUnit: elevation,
      elevationUnitDefaulted: a.elevationUnit === undefined,
    };
  }

  private startSurface(name: string | undefined): void {
    this.surface = {
      name: name ?? `Surface ${this.surfaces.length + 1}`,
      surfType: null,
      x: new FloatColumn(),
      y: new FloatColumn(),
      z: new FloatColumn(),
      faces: new IndexColumn(),
      invisibleFaces: 0,
      boundaries: [],
      breaklines: [],
      ids: null,
    };
  }

  private addPoint(text: string): void {
    const s = this.surface!;
    const v = this.scratch;
    if (scanNumbers(text, v) !== 3) {
      this.issue(
        this.textLine,
        `${s.name}, <P id="${this.pointId}">`,
        `Expected "northing easting elevation", found "${text.trim().slice(0, 80)}"`,
      );
      return;
    }
    const index = s.x.n;
    if (s.ids === null && this.pointId !== String(index + 1)) {
      s.ids = new Map();
      for (let i = 0; i < index; i++) s.ids.set(String(i + 1), i);
    }
    if (s.ids) {
      if (s.ids.has(this.pointId)) {
        this.issue(this.textLine, `${s.name}, <P id="${this.pointId}">`, 'The point id is used twice in this surface');
        return;
      }
      s.ids.set(this.pointId, index);
    }
    s.y.push(v[0]!);
    s.x.push(v[1]!);
    s.z.push(v[2]!);
  }

  private pointIndex(s: SurfaceBuild, id: string): number {
    if (s.ids) return s.ids.get(id) ?? -1;
    const k = Number(id);
    return Number.isInteger(k) && k >= 1 && k <= s.x.n && String(k) === id ? k - 1 : -1;
  }

  private addFace(text: string): void {
    const s = this.surface!;
    const v = this.scratch;
    const k = this.faceIndex;
    let count = s.ids ? -1 : scanIds(text, v);
    if (count >= 0) {
      // Ids 1, 2, 3... in order: the id is the index plus one.
      for (let i = 0; i < count && i < 4; i++) k[i] = v[i]! <= s.x.n ? v[i]! - 1 : -1;
    } else {
      const ids = text.trim().split(/\s+/);
      count = ids.length;
      for (let i = 0; i < Math.min(count, 4); i++) k[i] = this.pointIndex(s, ids[i]!);
    }
    if (count !== 3 && count !== 4) {
      this.issue(
        this.textLine,
        `${s.name}, <F> "${text.trim().slice(0, 40)}"`,
        `A face lists 3 point ids (4 on a grid), found ${count}`,
      );
      return;
    }
    let missing = -1;
    for (let i = count - 1; i >= 0; i--) if (k[i]! < 0) missing = i;
    if (missing >= 0) {
      const id = text.trim().split(/\s+/)[missing];
      this.issue(
        this.textLine,
        `${s.name}, <F> "${text.trim().slice(0, 40)}"`,
        `Point id ${id} is not among the surface's <Pnts>`,
      );
      return;
    }
    if (this.faceInvisible) {
      s.invisibleFaces++;
      return;
    }
    s.faces.push(k[0]!);
    s.faces.push(k[1]!);
    s.faces.push(k[2]!);
    if (count === 4) {
      s.faces.push(k[0]!);
      s.faces.push(k[2]!);
      s.faces.push(k[3]!);
    }
  }

  private addList(width: 2 | 3, text: string): void {
    const v = numbersOf(text);
    if (this.breakline !== null && this.surface && this.parent() === 'Breakline') {
      if (width !== 3 || v.length % 3 !== 0 || v.length < 6 || !v.every(Number.isFinite)) {
        this.issue(
          this.textLine,
          `${this.surface.name}, <Breakline name="${this.breakline}">`,
          'A breakline is a PntList3D of at least two "northing easting elevation" points',
        );
        return;
      }
      const line: [number, number, number][] = [];
      for (let i = 0; i < v.length; i += 3) line.push([v[i + 1]!, v[i]!, v[i + 2]!]);
      this.surface.breaklines.push(line);
      return;
    }
    if (this.boundary && this.parent() === 'Boundary') {
      if (v.length % width !== 0 || !v.every(Number.isFinite)) {
        this.issue(
          this.textLine,
          `Boundary "${this.boundary.name}"`,
          `Expected ${width === 3 ? 'northing easting elevation' : 'northing easting'} numbers`,
        );
        return;
      }
      for (let i = 0; i < v.length; i += width) this.boundary.ring.push([v[i + 1]!, v[i]!]);
      return;
    }
    if (this.sectionLine && this.section) {
      const where = `<CrossSect sta="${this.section.station}"> ${this.sectionLine.name}`;
      if (width !== 2 || v.length % 2 !== 0 || !v.every(Number.isFinite)) {
        this.issue(this.textLine, where, 'PntList2D must be pairs of numbers: offset elevation');
        return;
      }
      const part: [number, number][] = [];
      for (let i = 0; i < v.length; i += 2) part.push([v[i]!, v[i + 1]!]);
      this.sectionLine.parts.push(part);
    }
  }

  private finishSurface(s: SurfaceBuild): void {
    this.surfaces.push({
      name: s.name,
      surfType: s.surfType,
      x: s.x.done(),
      y: s.y.done(),
      z: s.z.done(),
      faces: s.faces.done(),
      invisibleFaces: s.invisibleFaces,
      boundaries: s.boundaries,
      breaklines: s.breaklines,
    });
  }

  private number(a: Record<string, string>, key: string, where: string, required: boolean): number | null {
    const raw = a[key];
    if (raw === undefined) {
      if (required) this.issue(this.parser.line, where, `${key} is missing`);
      return null;
    }
    const n = numbersOf(raw);
    if (n.length !== 1 || !Number.isFinite(n[0])) {
      this.issue(this.parser.line, where, `${key}="${raw}" is not a number`);
      return null;
    }
    return n[0]!;
  }

  private startAlignment(a: Record<string, string>): void {
    const name = a.name ?? `Alignment ${this.alignments.length + 1}`;
    const where = `<Alignment name="${name}">`;
    this.alignment = {
      name,
      staStart: this.number(a, 'staStart', where, true) ?? 0,
      length: this.number(a, 'length', where, false),
      equations: [],
    };
  }

  private addEquation(a: Record<string, string>): void {
    const where = `${this.alignment!.name}, <StaEquation>`;
    const staInternal = this.number(a, 'staInternal', where, true);
    const staAhead = this.number(a, 'staAhead', where, true);
    if (staInternal === null || staAhead === null) return;
    this.alignment!.equations.push({
      staInternal,
      staAhead,
      staBack: this.number(a, 'staBack', where, false),
      increasing: a.staIncrement !== 'decreasing',
    });
  }

  private startSection(a: Record<string, string>): void {
    const station = this.number(a, 'sta', `<CrossSect name="${a.name ?? ''}">`, true);
    if (station === null) return;
    this.section = {
      alignment: this.alignment?.name ?? null,
      station,
      shownStation: station,
      stationRegion: 0,
      line: this.parser.line,
      surfaces: [],
    };
  }
}

/** Reads a whole LandXML text (streamed through the SAX parser in one piece). */
export function readLandXml(text: string, options?: LandXmlReadOptions): LandXmlDocument {
  return new LandXmlReader(options).write(text).end();
}

/** Reads LandXML from a stream of text pieces (a File's stream through TextDecoderStream in a worker). */
export async function readLandXmlStream(
  pieces: AsyncIterable<string>,
  options?: LandXmlReadOptions,
): Promise<LandXmlDocument> {
  const reader = new LandXmlReader(options);
  for await (const piece of pieces) reader.write(piece);
  return reader.end();
}
