import { describe, expect, it } from 'vitest';
import { fileText } from '@/features/worksheets/surface/file-text';
import { surveyFromDoc } from '@/features/worksheets/surface/surface-file';
import { readLandXml, readLandXmlStream } from '@/shared/landxml';

/**
 * Issue 13: a large LandXML surface is read in the worker from the File's stream, piece by piece, never as one
 * text. Checked here on a Blob (what a File is) of 60,000 points: the pieces are many, and the surface read from
 * them is the one read from the whole text. Element names from the LandXML 1.2 schema.
 */
function bigSurface(n: number): string {
  const pts: string[] = [];
  const faces: string[] = [];
  const side = Math.ceil(Math.sqrt(n));
  for (let i = 0; i < n; i++)
    pts.push(
      `<P id="${i + 1}">${8000 + Math.floor(i / side)} ${5000 + (i % side)} ${(100 + Math.sin(i)).toFixed(4)}</P>`,
    );
  for (let i = 0; i + side + 1 < n; i += 7) faces.push(`<F>${i + 1} ${i + 2} ${i + side + 2}</F>`);
  return `<?xml version="1.0" encoding="UTF-8"?>
<LandXML xmlns="http://www.landxml.org/schema/LandXML-1.2" version="1.2">
<Units><Imperial linearUnit="foot" elevationUnit="foot"/></Units>
<Surfaces><Surface name="Terrain – été"><Definition surfType="TIN"><Pnts>${pts.join('\n')}</Pnts>
<Faces>${faces.join('')}</Faces></Definition></Surface></Surfaces></LandXML>`;
}

describe('a LandXML File streamed in pieces', () => {
  it('reads the same surface from the stream as from the whole text, in many pieces', async () => {
    const text = bigSurface(60_000);
    // A File of parts cut every 65,537 bytes (as a browser reads one in chunks), so some cuts fall inside a
    // character of two bytes: the decoder must carry them over.
    const bytes = new TextEncoder().encode(text.replace('<Pnts>', '<Pnts>' + '<!-- é -->'.repeat(20_000)));
    const parts: BlobPart[] = [];
    for (let i = 0; i < bytes.length; i += 65_537) parts.push(bytes.slice(i, i + 65_537));
    const blob = new Blob(parts, { type: 'application/xml' });
    let pieces = 0;
    let longest = 0;
    async function* counted() {
      for await (const piece of fileText(blob)) {
        pieces++;
        longest = Math.max(longest, piece.length);
        yield piece;
      }
    }
    const streamed = await readLandXmlStream(counted());
    const whole = readLandXml(text);
    expect(streamed.issues).toEqual([]);
    expect(pieces).toBeGreaterThan(3);
    expect(longest).toBeLessThan(text.length / 2);
    const a = streamed.surfaces[0]!,
      b = whole.surfaces[0]!;
    expect(a.name).toBe('Terrain – été');
    expect(a.x.length).toBe(60_000);
    expect([...a.x]).toEqual([...b.x]);
    expect([...a.z]).toEqual([...b.z]);
    expect([...a.faces]).toEqual([...b.faces]);
    // The worksheet's survey from the streamed document uses the faces as given.
    const read = surveyFromDoc(streamed, 'ft');
    expect(read.issues).toEqual([]);
    expect(read.faces!.length).toBe(b.faces.length / 3);
    expect(read.note).toContain('faces used as given');
  });
});
