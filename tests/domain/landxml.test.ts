import { describe, expect, it } from 'vitest';
import {
  boundariesIn,
  factorTo,
  LandXmlReader,
  readLandXml,
  readLandXmlStream,
  readPointCsv,
  sectionsIn,
  shownStation,
  surfacePointsIn,
} from '@/shared/landxml';

/**
 * The LandXML 1.2 reader against files written here, element by element. Element and attribute names, the
 * northing-easting-elevation order of <P>, the i="1" invisible face, the bndType values, and the default
 * elevationUnit="meter" are from the LandXML 1.2 schema (LandXML-1.2.xsd, 2008-07-29: types Metric, Imperial, P,
 * F, Boundary, CrossSect, CrossSectSurf, PntList2D, StaEquation). Unit lengths: international foot 0.3048 m and
 * US survey foot 1200/3937 m (NIST, "U.S. survey foot" and Federal Register 85 FR 62698).
 */
const doc = (units: string, body: string) =>
  `<?xml version="1.0" encoding="UTF-8"?>
<LandXML xmlns="http://www.landxml.org/schema/LandXML-1.2" version="1.2" date="2026-12-05" time="01:00:00">
  <Units>${units}</Units>
  ${body}
</LandXML>`;

const METRIC =
  '<Metric areaUnit="squareMeter" linearUnit="meter" volumeUnit="cubicMeter" temperatureUnit="celsius" pressureUnit="milliBars" angularUnit="decimal degrees" directionUnit="decimal degrees"/>';

const pad = (units: string) =>
  doc(
    units,
    `<Surfaces><Surface name="Yard pad">
      <SourceData><Boundaries>
        <Boundary name="limits" bndType="outer"><PntList2D>0 0 0 30 20 30 20 0 0 0</PntList2D></Boundary>
        <Boundary name="tank" bndType="void"><PntList3D>5 5 9 5 10 9 10 10 9 10 5 9</PntList3D></Boundary>
      </Boundaries></SourceData>
      <Definition surfType="TIN">
        <Pnts>
          <P id="1">0 0 10</P><P id="2">0 30 11</P><P id="3">20 30 12</P><P id="4">20 0 13</P>
        </Pnts>
        <Faces><F>1 2 3</F><F>1 3 4</F><F i="1">2 3 4</F></Faces>
      </Definition>
    </Surface></Surfaces>`,
  );

describe('LandXML 1.2 surfaces', () => {
  it('reads <P> as northing easting elevation into x = easting, y = northing (schema: P is "northing easting elevation")', () => {
    const d = readLandXml(pad(METRIC));
    expect(d.issues).toEqual([]);
    const s = d.surfaces[0]!;
    expect(s.name).toBe('Yard pad');
    expect(s.surfType).toBe('TIN');
    expect([...s.x]).toEqual([0, 30, 30, 0]);
    expect([...s.y]).toEqual([0, 0, 20, 20]);
    expect([...s.z]).toEqual([10, 11, 12, 13]);
  });

  it('keeps the faces as given and leaves out the invisible one (F i="1", schema)', () => {
    const s = readLandXml(pad(METRIC)).surfaces[0]!;
    expect([...s.faces]).toEqual([0, 1, 2, 0, 2, 3]);
    expect(s.invisibleFaces).toBe(1);
  });

  it('splits a grid face of four point ids into two triangles', () => {
    const xml = doc(
      METRIC,
      `<Surfaces><Surface name="g"><Definition surfType="grid"><Pnts>
      <P id="a">0 0 1</P><P id="b">0 1 1</P><P id="c">1 1 1</P><P id="d">1 0 1</P></Pnts>
      <Faces><F>a b c d</F></Faces></Definition></Surface></Surfaces>`,
    );
    expect([...readLandXml(xml).surfaces[0]!.faces]).toEqual([0, 1, 2, 0, 2, 3]);
  });

  it('resolves point ids that are not 1, 2, 3... and refuses a face naming a missing point, with its line', () => {
    const xml = doc(
      METRIC,
      `<Surfaces><Surface name="s"><Definition><Pnts>
<P id="10">0 0 1</P><P id="20">0 1 1</P><P id="30">1 1 1</P></Pnts>
<Faces><F>30 20 10</F>
<F>10 20 99</F></Faces></Definition></Surface></Surfaces>`,
    );
    const d = readLandXml(xml);
    expect([...d.surfaces[0]!.faces]).toEqual([2, 1, 0]);
    expect(d.issues).toHaveLength(1);
    expect(d.issues[0]!.message).toContain('Point id 99');
    expect(d.issues[0]!.line).toBe(7);
  });

  it('reads outer and void boundaries (SourceData/Boundaries/Boundary@bndType) in plan x, y', () => {
    const s = readLandXml(pad(METRIC)).surfaces[0]!;
    expect(s.boundaries.map((b) => [b.name, b.kind])).toEqual([
      ['limits', 'outer'],
      ['tank', 'void'],
    ]);
    expect(s.boundaries[0]!.ring[1]).toEqual([30, 0]);
    expect(s.boundaries[1]!.ring).toEqual([
      [5, 5],
      [10, 5],
      [10, 10],
      [5, 10],
    ]);
  });

  it('names the line and point of a bad <P> and of an id used twice', () => {
    const xml = doc(
      METRIC,
      `<Surfaces><Surface name="s"><Definition><Pnts>
<P id="1">0 0 1</P>
<P id="2">0 1 x</P>
<P id="1">2 2 2</P></Pnts></Definition></Surface></Surfaces>`,
    );
    const { issues } = readLandXml(xml);
    expect(issues).toEqual([
      { line: 6, column: 's, <P id="2">', message: 'Expected "northing easting elevation", found "0 1 x"' },
      { line: 7, column: 's, <P id="1">', message: 'The point id is used twice in this surface' },
    ]);
  });

  it('refuses text that is not well-formed XML, or not LandXML, with the line', () => {
    const broken = readLandXml('<?xml version="1.0"?>\n<LandXML>\n<Surfaces>\n</LandXML>');
    expect(broken.issues[0]!.message).toMatch(/Not well-formed XML/);
    expect(broken.issues[0]!.line).toBe(4);
    expect(readLandXml('<kml></kml>').issues[0]!.message).toMatch(/Not a LandXML file/);
    expect(readLandXml('x,y,z\n1,2,3').issues.length).toBeGreaterThan(0);
  });

  it('reads the same file fed in pieces of any size (a stream)', async () => {
    const xml = pad(METRIC);
    const whole = readLandXml(xml);
    for (const size of [1, 7, 64]) {
      const r = new LandXmlReader();
      for (let i = 0; i < xml.length; i += size) r.write(xml.slice(i, i + size));
      const d = r.end();
      expect([...d.surfaces[0]!.z]).toEqual([...whole.surfaces[0]!.z]);
      expect([...d.surfaces[0]!.faces]).toEqual([...whole.surfaces[0]!.faces]);
    }
    async function* pieces() {
      yield xml.slice(0, 100);
      yield xml.slice(100);
    }
    expect((await readLandXmlStream(pieces())).surfaces[0]!.x.length).toBe(4);
  });
});

describe('LandXML 1.2 units', () => {
  it('Metric: metres, elevationUnit written', () => {
    const d = readLandXml(
      pad('<Metric linearUnit="meter" elevationUnit="meter" areaUnit="squareMeter" volumeUnit="cubicMeter"/>'),
    );
    expect(d.units).toEqual({
      system: 'Metric',
      linearUnit: 'meter',
      elevationUnit: 'meter',
      elevationUnitDefaulted: false,
    });
  });

  it('Imperial without elevationUnit: the elevations are metres (schema default "meter"), converted to feet by 0.3048', () => {
    const d = readLandXml(
      pad(
        '<Imperial areaUnit="squareFoot" linearUnit="foot" volumeUnit="cubicYard" temperatureUnit="fahrenheit" pressureUnit="inHG"/>',
      ),
    );
    expect(d.units).toEqual({
      system: 'Imperial',
      linearUnit: 'foot',
      elevationUnit: 'meter',
      elevationUnitDefaulted: true,
    });
    const ft = surfacePointsIn(d.surfaces[0]!, d.units, 'ft');
    // Plan stays in feet; 10 m = 10 / 0.3048 ft = 32.80839895... ft.
    expect([...ft.x]).toEqual([0, 30, 30, 0]);
    expect(ft.z[0]).toBeCloseTo(32.808398950131, 10);
    expect(ft.z[3]).toBeCloseTo(13 / 0.3048, 12);
  });

  it('US survey feet are told apart from feet: 1 US survey foot = 1200/3937 m (NIST)', () => {
    const d = readLandXml(
      pad(
        '<Imperial linearUnit="USSurveyFoot" elevationUnit="USSurveyFoot" areaUnit="squareFoot" volumeUnit="cubicYard"/>',
      ),
    );
    expect(d.units.linearUnit).toBe('USSurveyFoot');
    const m = surfacePointsIn(d.surfaces[0]!, d.units, 'm');
    // 30 US survey ft = 30 x 1200 / 3937 m = 9.14401828803658 m (hand computation).
    expect(m.x[1]).toBeCloseTo(9.14401828803658, 12);
    const ft = surfacePointsIn(d.surfaces[0]!, d.units, 'ft');
    // 1 US survey ft = 1.000002000004 international ft (1200/3937/0.3048): 30 -> 30.00006000012.
    expect(ft.x[1]).toBeCloseTo(30.00006000012, 10);
    expect(ft.z[0]).toBeCloseTo(10.00002000004, 10);
    // A State Plane northing of 2,000,000 US survey ft is 4 ft more in international feet (2 ppm).
    expect(2_000_000 * factorTo('USSurveyFoot', 'ft') - 2_000_000).toBeCloseTo(4.000008, 5);
    expect(factorTo('foot', 'ft')).toBe(1);
    expect(factorTo('foot', 'm')).toBe(0.3048);
    expect(factorTo('meter', 'ft')).toBe(1 / 0.3048);
  });

  it('converts boundaries with the linear unit', () => {
    const d = readLandXml(pad('<Imperial linearUnit="foot"/>'));
    expect(boundariesIn(d.surfaces[0]!.boundaries, d.units, 'm')[0]!.ring[2]).toEqual([30 * 0.3048, 20 * 0.3048]);
  });

  it('names an unknown unit', () => {
    const d = readLandXml(pad('<Imperial linearUnit="furlong"/>'));
    expect(d.issues[0]).toMatchObject({ column: '<Imperial linearUnit>', message: 'Unknown length unit "furlong"' });
  });

  it('without <Units> says so (system null) so the screen asks', () => {
    expect(readLandXml(doc('', '')).units.system).toBeNull();
  });
});

const road = doc(
  '<Imperial linearUnit="foot" elevationUnit="foot"/>',
  `<Alignments><Alignment name="Haul road" staStart="1000" length="900">
    <StaEquation staInternal="1400" staBack="1400" staAhead="2000"/>
    <CrossSects name="road sections">
      <CrossSect sta="1200" name="a">
        <CrossSectSurf name="ground"><PntList2D>-40 99 0 100 40 101</PntList2D></CrossSectSurf>
        <CrossSectSurf name="design"><PntList2D>-30 100.5 -10 101</PntList2D><PntList2D>10 101 30 100.5</PntList2D></CrossSectSurf>
      </CrossSect>
      <CrossSect sta="1450" name="b">
        <CrossSectSurf name="ground"><PntList2D>-40 99 40 101</PntList2D></CrossSectSurf>
      </CrossSect>
    </CrossSects>
  </Alignment></Alignments>`,
);

describe('LandXML 1.2 cross sections and alignments', () => {
  it('reads CrossSect@sta with each CrossSectSurf; two PntList2D in one line are a gap', () => {
    const d = readLandXml(road);
    expect(d.issues).toEqual([]);
    const [a, b] = d.crossSections;
    expect(a!.alignment).toBe('Haul road');
    expect(a!.station).toBe(1200);
    expect(a!.surfaces[0]!.parts).toEqual([
      [
        [-40, 99],
        [0, 100],
        [40, 101],
      ],
    ]);
    expect(a!.surfaces[1]!.parts).toHaveLength(2);
    expect(b!.surfaces).toHaveLength(1);
  });

  it('shows stations with the equation applied: internal 1450 after 1400 back = 2000 ahead is 2050', () => {
    const d = readLandXml(road);
    expect(d.alignments[0]).toMatchObject({ name: 'Haul road', staStart: 1000, length: 900 });
    expect(d.alignments[0]!.equations).toEqual([
      { staInternal: 1400, staAhead: 2000, staBack: 1400, increasing: true },
    ]);
    expect(d.crossSections.map((s) => [s.station, s.shownStation, s.stationRegion])).toEqual([
      [1200, 1200, 0],
      [1450, 2050, 1],
    ]);
  });

  it('applies several equations in order, and a decreasing one (StaEquation@staIncrement)', () => {
    const eqs = [
      { staInternal: 500, staAhead: 800, staBack: 500, increasing: true },
      { staInternal: 200, staAhead: 100, staBack: 200, increasing: true },
      { staInternal: 700, staAhead: 5000, staBack: 1000, increasing: false },
    ];
    expect(shownStation(eqs, 150)).toEqual({ station: 150, region: 0 });
    expect(shownStation(eqs, 250)).toEqual({ station: 150, region: 1 });
    expect(shownStation(eqs, 600)).toEqual({ station: 900, region: 2 });
    expect(shownStation(eqs, 750)).toEqual({ station: 4950, region: 3 });
  });

  it('converts stations and offsets by the linear unit, elevations by theirs', () => {
    const d = readLandXml(road);
    const m = sectionsIn(d.crossSections, d.units, 'm');
    expect(m[1]!.shownStation).toBeCloseTo(2050 * 0.3048, 10);
    expect(m[0]!.surfaces[0]!.parts[0]![2]).toEqual([40 * 0.3048, 101 * 0.3048]);
  });

  it('refuses a CrossSect without sta and an odd PntList2D', () => {
    const xml = doc(
      METRIC,
      `<CrossSects><CrossSect name="x"/><CrossSect sta="10"><CrossSectSurf name="g"><PntList2D>1 2 3</PntList2D></CrossSectSurf></CrossSect></CrossSects>`,
    );
    const { issues } = readLandXml(xml);
    expect(issues.map((i) => i.message)).toEqual([
      'sta is missing',
      'PntList2D must be pairs of numbers: offset elevation',
    ]);
  });
});

describe('point files in PNEZD or PENZD order (common practice: the order varies between field files)', () => {
  it('detects PNEZD from a header and reads northing into y', () => {
    const f = readPointCsv('P,N,E,Z,D\n1,5000,2000,100.5,EG shot\n2,5010,2003,100.7,EG');
    expect([f.order, f.orderFrom, f.needsOrder]).toEqual(['PNEZD', 'header', false]);
    expect([f.x, f.y, f.z]).toEqual([
      [2000, 2003],
      [5000, 5010],
      [100.5, 100.7],
    ]);
    expect(f.descriptions[0]).toBe('EG shot');
  });

  it('detects PENZD from a header with words', () => {
    const f = readPointCsv('Point,Easting,Northing,Elevation,Description\n1,2000,5000,100.5,x');
    expect([f.order, f.x[0], f.y[0]]).toEqual(['PENZD', 2000, 5000]);
  });

  it('asks when the data do not tell (no header), and reads in the order given', () => {
    const text = '1 5000 2000 100.5 EG\n2 5010 2003 100.7 EG';
    const unknown = readPointCsv(text);
    expect([unknown.needsOrder, unknown.order, unknown.x.length]).toEqual([true, null, 0]);
    const asPenzd = readPointCsv(text, 'PENZD');
    expect([asPenzd.orderFrom, asPenzd.x[0], asPenzd.y[0]]).toEqual(['given', 5000, 2000]);
  });

  it('names the line and field of a bad value and of a repeated point, and a header that disagrees', () => {
    const f = readPointCsv('P,N,E,Z\n1,5000,2000,100\n2,5000,abc,100\n1,1,1,1', 'PNEZD');
    expect(f.issues).toEqual([
      { line: 3, column: 'easting', message: '"abc" is not a number' },
      { line: 4, column: 'point', message: 'Point 1 is listed again (first on line 2)' },
    ]);
    expect(readPointCsv('P,E,N,Z\n1,2,3,4', 'PNEZD').issues[0]!.message).toBe(
      'The header says PENZD, but PNEZD was chosen',
    );
  });

  it('refuses NaN and infinite values naming the line, and reports one plan position with two elevations', () => {
    const f = readPointCsv(
      '1,5000,2000,100\n2,NaN,2001,100\n3,5001,-Infinity,100\n4,5002,2002,1e999\n5,5000,2000,101',
      'PNEZD',
    );
    expect(f.issues).toEqual([
      { line: 2, column: 'northing', message: '"NaN" is not a finite number (NaN and infinite values are refused)' },
      {
        line: 3,
        column: 'easting',
        message: '"-Infinity" is not a finite number (NaN and infinite values are refused)',
      },
      { line: 4, column: 'elevation', message: '"1e999" is not a finite number (NaN and infinite values are refused)' },
      {
        line: 5,
        column: 'elevation',
        message: 'Point 5 has the plan position of point 1 (line 1) with another elevation (101 against 100)',
      },
    ]);
    // The same plan position with the same elevation is one point surveyed twice: kept (the engine keeps it once).
    expect(readPointCsv('1,5000,2000,100\n2,5000,2000,100', 'PNEZD').issues).toEqual([]);
  });
});
