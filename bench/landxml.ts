import { SaxesParser } from 'saxes';
import { readLandXml, surfacePointsIn } from '../src/shared/landxml';
import { defineBench, type BenchEntry } from './types';

/**
 * A LandXML 1.2 surface of 1,000 x 1,000 points (about 2 million faces), as a designer's program writes it: a
 * single text of about 90 MB. Deterministic.
 */
function landXmlSurface(n: number): string {
  const parts: string[] = [
    '<?xml version="1.0" encoding="UTF-8"?>\n<LandXML xmlns="http://www.landxml.org/schema/LandXML-1.2" version="1.2">\n',
    '<Units><Imperial linearUnit="USSurveyFoot" elevationUnit="USSurveyFoot" areaUnit="squareFoot" volumeUnit="cubicYard"/></Units>\n',
    '<Surfaces><Surface name="Bench ground"><Definition surfType="TIN"><Pnts>\n',
  ];
  for (let i = 0, k = 1; i < n; i++) {
    for (let j = 0; j < n; j++, k++) {
      const north = 812000 + i + 0.3 * Math.cos(k * 78.233);
      const east = 2105000 + j + 0.3 * Math.sin(k * 12.9898);
      const z = 100 + 5 * Math.sin(j / 50) + 0.01 * i;
      parts.push(`<P id="${k}">${north.toFixed(3)} ${east.toFixed(3)} ${z.toFixed(3)}</P>\n`);
    }
  }
  parts.push('</Pnts><Faces>\n');
  for (let i = 0; i + 1 < n; i++) {
    for (let j = 0; j + 1 < n; j++) {
      const a = i * n + j + 1;
      parts.push(`<F>${a} ${a + 1} ${a + n + 1}</F>\n<F>${a} ${a + n + 1} ${a + n}</F>\n`);
    }
  }
  parts.push('</Faces></Definition></Surface></Surfaces>\n</LandXML>\n');
  return parts.join('');
}

const landxml: BenchEntry<string> = {
  name: 'landxml-1m-point-surface',
  baseline: 'saxes alone on the same text, its tags and text events counted',
  // The reader adds the numbers, the faces and the unit conversion to the XML tokenizing every reader needs.
  budget: 3,
  memoryBudgetMB: 1536,
  repeats: 3,
  setup: () => landXmlSurface(Number(process.env.LANDXML_BENCH_N ?? 1000)),
  run: (xml) => {
    const doc = readLandXml(xml);
    if (doc.issues.length > 0) throw new Error(doc.issues[0]!.message);
    return surfacePointsIn(doc.surfaces[0]!, doc.units, 'ft').z.length + doc.surfaces[0]!.faces.length;
  },
  runBaseline: (xml) => {
    const parser = new SaxesParser({ position: true });
    let n = 0;
    parser.on('opentag', () => n++);
    parser.on('text', (t) => (n += t.length));
    parser.write(xml).close();
    return n;
  },
};

export const benchmarks = [defineBench(landxml)];
