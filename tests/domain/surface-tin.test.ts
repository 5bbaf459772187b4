import { describe, expect, it } from 'vitest';
import { DomainError } from '../../src/shared/domain/domain-error';
import { surfaceVolume, surfaceVolumeFromPoints } from '../../src/shared/domain/earthwork/surface';
import { buildTin } from '../../src/shared/domain/earthwork/surface-tin';
import { readSurvey } from '@/features/worksheets/surface/surface-file';
import { readLandXml } from '@/shared/landxml';
import { grid, referenceOf, refTin, rel, type P3 } from './surface-reference';

/**
 * Issue 13: a surface's faces used as given, and breaklines constraining the triangulation of a point survey.
 * Hand-computed volumes use the triangular-prism method (surveying texts; reference.md section 9: prism volume =
 * plan area x mean of its three depths). The random case is checked against the reference of
 * surface-reference.ts (every pair of triangles intersected with polygon-clipping, written in the tests).
 */

const codeOf = (f: () => unknown): DomainError => {
  try {
    f();
  } catch (e) {
    if (e instanceof DomainError) return e;
    throw e;
  }
  throw new Error('expected a DomainError');
};

/** True when the mesh has an edge between points i and j. */
function hasEdge(triangles: Uint32Array, i: number, j: number): boolean {
  for (let t = 0; t < triangles.length; t += 3) {
    const c = [triangles[t]!, triangles[t + 1]!, triangles[t + 2]!];
    if (c.includes(i) && c.includes(j)) return true;
  }
  return false;
}

// A kite whose short diagonal B-D is the Delaunay one (the angles at A and C are small); the long one A-C is not.
const A: P3 = [0, 0, 0];
const B: P3 = [10, -1, 3];
const C: P3 = [20, 0, 0];
const D: P3 = [10, 1, 3];
const kite = [A, B, C, D];
const flat0: P3[] = [
  [-5, -5, 0],
  [25, -5, 0],
  [25, 5, 0],
  [-5, 5, 0],
];

describe('faces used as given', () => {
  it('a kite split along A-C gives its own volume, not the Delaunay one: 20 cu ft against 40 (prism method by hand)', () => {
    // By hand: A-C split: triangles ABC and ACD, each 10 sq ft (1/2 x 20 x 1) with mean depth (0 + 3 + 0)/3 = 1 ft,
    // 20 cu ft. Delaunay (B-D): ABD and BCD, each 10 sq ft with mean depth (0 + 3 + 3)/3 = 2 ft, 40 cu ft.
    const faces: [number, number, number][] = [
      [0, 1, 2],
      [0, 2, 3],
    ];
    const given = surfaceVolume({ unit: 'ft', existing: kite, design: flat0, existingFaces: faces });
    expect(given.cut * 27).toBeCloseTo(20, 10);
    expect(given.fill).toBe(0);
    expect(given.footprintArea).toBeCloseTo(20, 10);
    expect(given.trail[0]).toContain("the file's faces as given");
    const delaunay = surfaceVolume({ unit: 'ft', existing: kite, design: flat0 });
    expect(delaunay.cut * 27).toBeCloseTo(40, 10);
  });

  it('reads the faces from LandXML: the invisible face (F i="1", LandXML 1.2 schema) is left out of the surface', () => {
    // Points as northing easting elevation. Three faces over the square 0..20; the third is invisible, so only
    // the two faces over x <= 10 are surface: 10 x 20 = 200 sq ft at 2 ft above the design plane z = 0.
    const xml = `<?xml version="1.0"?>
<LandXML xmlns="http://www.landxml.org/schema/LandXML-1.2" version="1.2">
  <Units><Imperial linearUnit="foot" elevationUnit="foot"/></Units>
  <Surfaces><Surface name="Stockpile floor"><Definition surfType="TIN">
    <Pnts><P id="1">0 0 2</P><P id="2">0 10 2</P><P id="3">20 10 2</P><P id="4">20 0 2</P>
      <P id="5">0 20 2</P><P id="6">20 20 2</P></Pnts>
    <Faces><F>1 2 3</F><F>1 3 4</F><F i="1">2 5 6 3</F></Faces>
  </Definition></Surface></Surfaces>
</LandXML>`;
    const doc = readLandXml(xml);
    expect(doc.issues).toEqual([]);
    const s = doc.surfaces[0]!;
    expect(s.invisibleFaces).toBe(1);
    const plane: P3[] = [
      [-1, -1, 0],
      [30, -1, 0],
      [30, 30, 0],
      [-1, 30, 0],
    ];
    const r = surfaceVolumeFromPoints(
      'ft',
      { x: s.x, y: s.y, z: s.z, faces: s.faces },
      {
        x: plane.map((p) => p[0]),
        y: plane.map((p) => p[1]),
        z: plane.map((p) => p[2]),
      },
    );
    expect(r.footprintArea).toBeCloseTo(200, 10);
    expect(r.cut * 27).toBeCloseTo(400, 10);
  });

  it('refuses a face naming a point that is not there, naming the face and the point', () => {
    const e = codeOf(() =>
      surfaceVolume({
        unit: 'ft',
        existing: kite,
        design: flat0,
        existingFaces: [
          [0, 1, 2],
          [0, 2, 7],
        ],
      }),
    );
    expect(e.code).toBe('INVALID_FACE');
    expect(e.message).toBe('Face 2 of the existing surface names point 8, which is not among its 4 points');
    expect(e.issues[0]!.path).toBe('existingFaces.1.2');
    // The reader refuses it too, naming the id (LandXML: an F lists ids of the surface's P elements).
    const doc = readLandXml(
      '<LandXML><Surfaces><Surface name="s"><Definition><Pnts><P id="1">0 0 0</P><P id="2">0 1 0</P><P id="3">1 1 0</P></Pnts><Faces><F>1 2 9</F></Faces></Definition></Surface></Surfaces></LandXML>',
    );
    expect(doc.issues[0]!.message).toContain('Point id 9 is not among');
  });

  it('refuses two faces on the same side of one edge (they overlap in plan), and takes either winding', () => {
    const overlap = codeOf(() =>
      surfaceVolume({
        unit: 'ft',
        existing: kite,
        design: flat0,
        existingFaces: [
          [0, 1, 2],
          [0, 1, 3],
          [0, 3, 2],
        ],
      }),
    );
    expect(overlap.code).toBe('INVALID_FACE');
    expect(overlap.message).toMatch(/^Faces \d and \d of the existing surface lie on the same side of the edge/);
    // Clockwise and counter-clockwise faces mixed: same 20 cu ft.
    const mixed = surfaceVolume({
      unit: 'ft',
      existing: kite,
      design: flat0,
      existingFaces: [
        [2, 1, 0],
        [0, 2, 3],
      ],
    });
    expect(mixed.cut * 27).toBeCloseTo(20, 10);
  });

  it('refuses faces that overlap in plan without sharing an edge, naming both faces and the surface', () => {
    // Two right triangles of legs 10 ft, the second shifted 2 ft each way: they share no point and no edge, yet
    // overlap over 6 x 6 / 2 = 18 sq ft (geometry).
    const pts: P3[] = [
      [0, 0, 5],
      [10, 0, 5],
      [0, 10, 5],
      [2, 2, 6],
      [12, 2, 6],
      [2, 12, 6],
    ];
    const crossing = codeOf(() =>
      surfaceVolume({
        unit: 'ft',
        existing: flat0,
        design: pts,
        designFaces: [
          [0, 1, 2],
          [3, 4, 5],
        ],
      }),
    );
    expect(crossing.code).toBe('INVALID_FACE');
    expect(crossing.message).toBe(
      'Faces 1 and 2 of the design surface overlap in plan without sharing an edge: the surface would have two heights there',
    );
    expect(crossing.issues[0]!.path).toBe('designFaces.1');
    // A face wholly inside another (no edge of one crosses the other), listed among faces that fit together.
    const nested: P3[] = [...pts.slice(0, 3), [1, 1, 7], [3, 1, 7], [1, 3, 7], [10, 10, 5]];
    const inside = codeOf(() =>
      surfaceVolume({
        unit: 'ft',
        existing: nested,
        design: flat0,
        existingFaces: [
          [1, 6, 2],
          [0, 1, 2],
          [3, 4, 5],
        ],
      }),
    );
    expect(inside.message).toBe(
      'Faces 2 and 3 of the existing surface overlap in plan without sharing an edge: the surface would have two heights there',
    );
  });

  it('finds one overlapping face among thousands that fit together, and passes them without it', () => {
    // A 60 x 60 grid of jittered points, two faces a square (6,962 faces), flat 1 ft over a design at 0 ft:
    // 1 ft x the grid's area (geometry). One extra face over three points of the middle rows overlaps its
    // neighbours without sharing an edge with any of them.
    const n = 60;
    const pts = grid(n, n, 0, 0, 590, 590, () => 1, 0.3, 21);
    const faces: [number, number, number][] = [];
    for (let i = 0; i + 1 < n; i++)
      for (let j = 0; j + 1 < n; j++) {
        const a = i * n + j;
        faces.push([a, a + 1, a + n + 1], [a, a + n + 1, a + n]);
      }
    const design: P3[] = [
      [-1, -1, 0],
      [600, -1, 0],
      [600, 600, 0],
      [-1, 600, 0],
    ];
    const ok = surfaceVolume({ unit: 'ft', existing: pts, design, existingFaces: faces });
    expect(rel(ok.cut * 27, 590 * 590)).toBeLessThan(1e-9);
    const mid = 30 * n + 30;
    const extra: [number, number, number] = [mid, mid + 2, mid + 2 * n + 1];
    const e = codeOf(() => surfaceVolume({ unit: 'ft', existing: pts, design, existingFaces: [...faces, extra] }));
    expect(e.message).toMatch(
      new RegExp(`^Faces \\d+ and ${faces.length + 1} of the existing surface overlap in plan without sharing an edge`),
    );
    expect(e.issues[0]!.path).toBe(`existingFaces.${faces.length}`);
  });

  it("keeps faces that meet at a point lying on another face's edge (a T-junction is no overlap)", () => {
    // Square 10 x 3 ft split along its diagonal; the upper half split again at a point on that diagonal (10/3, 1)
    // that binary floating point cannot hold exactly. Flat at 1 ft over a design at 0: 30 cu ft (geometry).
    const pts: P3[] = [
      [0, 0, 1],
      [10, 0, 1],
      [10, 3, 1],
      [0, 3, 1],
      [10 / 3, 1, 1],
    ];
    const r = surfaceVolume({
      unit: 'ft',
      existing: pts,
      design: [
        [0, 0, 0],
        [10, 0, 0],
        [10, 3, 0],
        [0, 3, 0],
      ],
      existingFaces: [
        [0, 1, 2],
        [0, 4, 3],
        [4, 2, 3],
      ],
    });
    expect(r.cut * 27).toBeCloseTo(30, 9);
  });

  it('non-convex face sets with a hole, on both sides, agree with the independent reference to 1e-9', () => {
    // A 9 x 7 grid of points; faces on alternating diagonals (not the Delaunay choice everywhere), with a notch
    // and a hole cut out of it. The design survey: the same kind of face set shifted, or Delaunay of a cloud.
    const build = (x0: number, y0: number, f: (x: number, y: number) => number, flip: number) => {
      const nx = 9,
        ny = 7;
      const pts = grid(nx, ny, x0, y0, 80, 60, f, 0.3, flip + 3);
      const faces: number[][] = [];
      for (let j = 0; j + 1 < ny; j++) {
        for (let i = 0; i + 1 < nx; i++) {
          if (j >= 4 && i >= 5) continue; // notch in one corner
          if (j === 2 && (i === 3 || i === 4)) continue; // hole in the middle
          const a = j * nx + i,
            b = a + 1,
            c = a + nx + 1,
            d = a + nx;
          if ((i + j + flip) % 2 === 0) faces.push([a, b, c], [a, c, d]);
          else faces.push([a, b, d], [b, c, d]);
        }
      }
      return { pts, faces };
    };
    const e = build(0, 0, (x, y) => 5 + Math.sin(x / 13) * 2 + y / 20, 0);
    const d = build(17, -9, (x, y) => 6 - Math.cos(y / 11) * 1.5 + x / 40, 1);
    const cols = (s: { pts: P3[]; faces: number[][] }) => ({
      x: s.pts.map((p) => p[0]),
      y: s.pts.map((p) => p[1]),
      z: s.pts.map((p) => p[2]),
      faces: s.faces.flat(),
    });
    const r = surfaceVolumeFromPoints('m', cols(e), cols(d));
    const ref = referenceOf(refTin(e.pts, e.faces), refTin(d.pts, d.faces));
    expect(r.cut).toBeGreaterThan(0);
    expect(r.fill).toBeGreaterThan(0);
    expect(rel(r.cut, ref.cut)).toBeLessThan(1e-9);
    expect(rel(r.fill, ref.fill)).toBeLessThan(1e-9);
    expect(rel(r.footprintArea, ref.area)).toBeLessThan(1e-9);
    // Faces on one side, a Delaunay cloud on the other, both ways round.
    const cloud = grid(6, 5, 5, 5, 70, 45, (x, y) => 5.5 + x / 50 - y / 70, 0.4, 9);
    const cloudCols = { x: cloud.map((p) => p[0]), y: cloud.map((p) => p[1]), z: cloud.map((p) => p[2]) };
    const r2 = surfaceVolumeFromPoints('m', cols(e), cloudCols);
    const ref2 = referenceOf(refTin(e.pts, e.faces), refTin(cloud));
    expect(rel(r2.cut, ref2.cut)).toBeLessThan(1e-9);
    expect(rel(r2.fill, ref2.fill)).toBeLessThan(1e-9);
    const r3 = surfaceVolumeFromPoints('m', cloudCols, cols(e));
    expect(rel(r3.cut, ref2.fill)).toBeLessThan(1e-9);
    expect(rel(r3.footprintArea, ref2.area)).toBeLessThan(1e-9);
  });
});

describe('breaklines constrain the triangulation of a point survey', () => {
  it('a breakline along A-C makes A-C an edge and gives 20 cu ft instead of the Delaunay 40 (prism method by hand)', () => {
    const plain = buildTin(
      { x: kite.map((p) => p[0]), y: kite.map((p) => p[1]), z: kite.map((p) => p[2]) },
      0,
      0,
      'existing',
    );
    expect(hasEdge(plain.mesh.triangles, 0, 2)).toBe(false);
    expect(hasEdge(plain.mesh.triangles, 1, 3)).toBe(true);
    const line = [A, C];
    const tin = buildTin(
      { x: kite.map((p) => p[0]), y: kite.map((p) => p[1]), z: kite.map((p) => p[2]), breaklines: [line] },
      0,
      0,
      'existing',
    );
    expect(tin.source).toBe('constrained');
    expect(tin.breaklineEdges).toBe(1);
    expect(hasEdge(tin.mesh.triangles, 0, 2)).toBe(true);
    const r = surfaceVolume({ unit: 'ft', existing: kite, design: flat0, existingBreaklines: [line] });
    expect(r.cut * 27).toBeCloseTo(20, 10);
    expect(r.trail[0]).toContain('constrained Delaunay, 1 breakline edges kept');
  });

  it('breakline vertices that are not surveyed points join the surface: a ridge 2 ft high gives 100 cu ft', () => {
    // Square 10 x 10 ft at z = 0 with a ridge line (0,5,2)-(10,5,2): each half is the plane through its edge at 0
    // and the ridge at 2 (z = 2y/5 below, 2(10 - y)/5 above), 10 x 5 sq ft at mean depth 1 ft: 50 + 50 cu ft.
    const square: P3[] = [
      [0, 0, 0],
      [10, 0, 0],
      [10, 10, 0],
      [0, 10, 0],
    ];
    const ridge: P3[] = [
      [0, 5, 2],
      [5, 5, 2],
      [10, 5, 2],
    ];
    const r = surfaceVolume({ unit: 'ft', existing: square, design: square, existingBreaklines: [ridge] });
    expect(r.cut * 27).toBeCloseTo(100, 10);
    expect(r.existingPoints).toBe(7);
  });

  it('refuses crossing breaklines and a breakline vertex on a point with another height, naming them', () => {
    const crossing = codeOf(() =>
      surfaceVolume({
        unit: 'ft',
        existing: kite,
        design: flat0,
        existingBreaklines: [
          [A, C],
          [B, D],
        ],
      }),
    );
    expect(crossing.code).toBe('BREAKLINE_CONFLICT');
    expect(crossing.message).toBe('Breakline 2 of the existing survey, segment 1 to 2: crosses another breakline');
    expect(crossing.issues[0]!.path).toBe('existingBreaklines.1.1');
    const clash = codeOf(() =>
      surfaceVolume({
        unit: 'ft',
        existing: kite,
        design: flat0,
        existingBreaklines: [
          [
            [0, 0, 1],
            [20, 0, 0],
          ],
        ],
      }),
    );
    expect(clash.code).toBe('DUPLICATE_POINT');
    expect(clash.message).toMatch(
      /Breakline 1, vertex 1 repeats the plan position of row 1 with another height|Row 1 repeats the plan position of Breakline 1, vertex 1/,
    );
  });
});

describe('where breaklines come from', () => {
  it('LandXML SourceData/Breaklines/Breakline PntList3D (northing easting elevation, LandXML 1.2 schema)', () => {
    const xml = `<LandXML><Units><Imperial linearUnit="foot" elevationUnit="foot"/></Units>
  <Surfaces><Surface name="Kite"><SourceData><Breaklines>
    <Breakline name="toe" brkType="standard"><PntList3D>0 0 0 0 20 0</PntList3D></Breakline>
  </Breaklines></SourceData><Definition surfType="TIN"><Pnts>
    <P id="1">0 0 0</P><P id="2">-1 10 3</P><P id="3">0 20 0</P><P id="4">1 10 3</P>
  </Pnts></Definition></Surface></Surfaces></LandXML>`;
    const doc = readLandXml(xml);
    expect(doc.issues).toEqual([]);
    const s = doc.surfaces[0]!;
    expect(s.breaklines).toEqual([
      [
        [0, 0, 0],
        [20, 0, 0],
      ],
    ]);
    const r = surfaceVolumeFromPoints(
      'ft',
      { x: s.x, y: s.y, z: s.z, breaklines: s.breaklines },
      { x: flat0.map((p) => p[0]), y: flat0.map((p) => p[1]), z: flat0.map((p) => p[2]) },
    );
    expect(r.cut * 27).toBeCloseTo(20, 10);
    const bad = readLandXml(xml.replace('0 0 0 0 20 0', '0 0 0'));
    expect(bad.issues[0]!.message).toContain('at least two "northing easting elevation" points');
  });

  it("a point file's breakline list names points by their names, and refuses a name not in the file", () => {
    const points = 'P,N,E,Z,D\nA,0,0,0,toe\nB,-1,10,3,\nC,0,20,0,toe\nD,1,10,3,';
    const read = readSurvey(points, 'ft', undefined, 'A C');
    expect(read.issues).toEqual([]);
    expect(read.kind).toBe('points');
    expect(read.breaklines).toEqual([
      [
        [0, 0, 0],
        [20, 0, 0],
      ],
    ]);
    expect(read.note).toContain('1 breaklines kept as edges');
    const missing = readSurvey(points, 'ft', undefined, 'A C\nB Q');
    expect(missing.issues).toEqual([{ line: 2, column: '(breakline)', message: 'Point Q is not in the point file' }]);
  });
});
