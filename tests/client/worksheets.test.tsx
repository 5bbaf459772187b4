// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { createMemoryRouter, RouterProvider } from 'react-router';
import { afterEach, describe, expect, it } from 'vitest';
import { worksheetKeys } from '@/features/worksheets/api/keys';
import type { WorksheetTally } from '@/features/worksheets/api/get-tally';
import { WorksheetsScreen } from '@/features/worksheets/components/worksheets-screen';
import { parseNumberTable, readNumber } from '@/features/worksheets/lib/csv';
import { readSectionLandXml } from '@/features/worksheets/end-area/section-file';
import { readSurvey } from '@/features/worksheets/surface/surface-file';
import { TrenchWorksheet } from '@/features/worksheets/trench/trench-worksheet';

afterEach(cleanup);

const noop = () => {};

async function typeInto(input: HTMLElement, text: string) {
  await userEvent.clear(input);
  await userEvent.type(input, text);
}

describe('Trench runs worksheet', () => {
  it('shows the live volume of a typed run and the 5 ft caution', async () => {
    render(
      <TrenchWorksheet
        unit="ft"
        initial={null}
        defaults={{ swellPercent: 25, shrinkagePercent: 10 }}
        onInputs={noop}
      />,
    );
    // Vertical sides: the textbook's average width is the run's width top and bottom.
    await userEvent.selectOptions(screen.getByLabelText('Protection'), 'box');
    await userEvent.click(screen.getByRole('button', { name: 'Remove run 2' }));
    await typeInto(screen.getByLabelText('Run 1 length'), '100');
    await typeInto(screen.getByLabelText('Run 1 depth'), '6');
    await typeInto(screen.getByLabelText('Run 1 bottom width'), '11');

    // Published example ("Measuring Excavation and Sitework", ch. 3, reference.md section 1): 100 ft x 11.0 ft
    // average width x 6.0 ft average depth = 6,600 cu ft = 244 CY (244.44 unrounded).
    const result = screen.getByRole('region', { name: 'Result' });
    expect(within(result).getByText('Excavation').nextElementSibling?.textContent).toBe('244.44 CY');

    // OSHA 29 CFR 1926.652(a)(1): a protective system at 5 ft or more unless in stable rock.
    const cautions = screen.getByRole('complementary', { name: 'Safety cautions' });
    expect(cautions.textContent).toMatch(/5 ft \(1\.524 m\) deep or more: a protective system is required/);
    expect(cautions.textContent).toMatch(/competent person/);
  });

  it('names the field of a bad entry instead of showing a volume', async () => {
    render(
      <TrenchWorksheet
        unit="ft"
        initial={null}
        defaults={{ swellPercent: 25, shrinkagePercent: 10 }}
        onInputs={noop}
      />,
    );
    await userEvent.clear(screen.getByLabelText('Run 1 depth'));
    const result = screen.getByRole('region', { name: 'Result' });
    expect(within(result).getByRole('alert').textContent).toMatch(/Run 1 depth: Enter a number/);
    expect(within(result).queryByText('Excavation')).toBeNull();
  });
});

describe('Worksheet file readers', () => {
  it('reads LandXML points as northing easting elevation (LandXML 1.2 schema, <P>) into x = easting, y = northing', () => {
    const xml = `<?xml version="1.0"?><LandXML xmlns="http://www.landxml.org/schema/LandXML-1.2"><Surfaces><Surface name="Pad">
      <Definition><Pnts><P id="1">5000.5 2000.25 101.2</P><P id="2">5010 2003 bad</P></Pnts></Definition></Surface></Surfaces></LandXML>`;
    expect(readSurvey(xml, 'm').issues).toEqual([expect.objectContaining({ column: 'Pad, <P id="2">' })]);
    const good = xml
      .replace('2003 bad', '2003 101.5')
      .replace('<Surfaces>', '<Units><Metric linearUnit="meter"/></Units><Surfaces>');
    const read = readSurvey(good, 'm');
    expect(read.rows).toEqual([
      [2000.25, 5000.5, 101.2],
      [2003, 5010, 101.5],
    ]);
    expect(read.note).toMatch(/LandXML surface "Pad": 2 points/);
  });

  it('asks the column order of a point file without a header, and reads PNEZD from a header (common practice)', () => {
    expect(readSurvey('1,5000,2000,100,EG\n2,5001,2001,100,EG', 'ft').needsOrder).toBe(true);
    expect(readSurvey('1,5000,2000,100,EG\n2,5001,2001,100,EG', 'ft', 'PNEZD').rows[0]).toEqual([2000, 5000, 100]);
    expect(readSurvey('P,N,E,Z,D\n1,5000,2000,100,EG', 'ft').rows[0]).toEqual([2000, 5000, 100]);
    expect(readSurvey('x,y,z\n1,2,3', 'ft').rows[0]).toEqual([1, 2, 3]);
  });

  it('reads LandXML cross sections with the station equation shown and refuses a line with a gap (LandXML 1.2 schema: CrossSect, PntList2D, StaEquation)', () => {
    const xml = `<LandXML><Units><Imperial linearUnit="foot" elevationUnit="foot"/></Units><Alignments><Alignment name="A" staStart="0">
      <StaEquation staInternal="100" staAhead="500"/><CrossSects>
      <CrossSect sta="150"><CrossSectSurf name="ground"><PntList2D>-10 100 10 100</PntList2D></CrossSectSurf><CrossSectSurf name="design"><PntList2D>-10 99 10 99</PntList2D></CrossSectSurf></CrossSect>
      <CrossSect sta="200"><CrossSectSurf name="ground"><PntList2D>-10 100 -2 100</PntList2D><PntList2D>2 100 10 100</PntList2D></CrossSectSurf><CrossSectSurf name="design"><PntList2D>-10 99 10 99</PntList2D></CrossSectSurf></CrossSect>
      </CrossSects></Alignment></Alignments></LandXML>`;
    const { sections, issues } = readSectionLandXml(xml, 'ft');
    expect(sections).toEqual([expect.objectContaining({ station: 150, shown: 550 })]);
    expect(issues).toEqual([
      expect.objectContaining({
        column: '<CrossSect sta="200"> ground',
        message: expect.stringMatching(/gap \(offsets -2 to 2\)/),
      }),
    ]);
  });

  it('reports a bad CSV cell by line and column', () => {
    const { values, issues } = parseNumberTable('x,y,z\n1,2,3\n4,five,6\n7,8', ['x', 'y', 'z']);
    expect(values).toEqual([[1, 2, 3]]);
    expect(issues).toEqual([
      { line: 3, column: 'y', message: '"five" is not a number' },
      { line: 4, column: '(row)', message: 'Expected 3 values (x, y, z), found 2' },
    ]);
  });

  it('reads station text 12+50 as 1250 ft (100 ft stations, common practice)', () => {
    expect(readNumber('12+50')).toBe(1250);
    expect(readNumber('12+50.5')).toBe(1250.5);
  });
});

describe('Worksheets screen', () => {
  const trenchItem = {
    id: '7d4e2b0a-0000-4000-8000-000000000001',
    projectId: 'p1',
    itemNumber: '3.10',
    description: 'Trench excavation',
    payUnit: 'CY' as const,
    basis: 'bank' as const,
    unitPriceCents: 1850,
    contractQuantity: 900,
    originalQuantity: 900,
    originalUnitPriceCents: 1850,
    originalAmountCents: 1665000,
    changeOrderNumbers: [],
    isMajor: false,
    method: 'trench' as const,
    contractAmountCents: 1665000,
    createdAt: '2026-10-01T00:00:00Z',
    updatedAt: '2026-10-01T00:00:00Z',
  };
  function renderScreen(canSave: boolean, opts: { tally?: WorksheetTally } = {}) {
    const client = new QueryClient();
    if (opts.tally) client.setQueryData(worksheetKeys.tally(opts.tally.tally.id), opts.tally);
    const screenElement = (
      <WorksheetsScreen
        projectId="p1"
        units="us"
        canSave={canSave}
        bidItems={[trenchItem]}
        defaults={{ swellPercent: 25, shrinkagePercent: 10 }}
      />
    );
    const router = createMemoryRouter([{ path: '/', element: screenElement }], {
      initialEntries: [opts.tally ? `/?tally=${opts.tally.tally.id}` : '/?method=trench'],
    });
    render(
      <QueryClientProvider client={client}>
        <RouterProvider router={router} />
      </QueryClientProvider>,
    );
  }

  it('offers Save as tally to the subcontractor once the worksheet has a result', async () => {
    renderScreen(true);
    await screen.findByRole('region', { name: 'Result' });
    expect((await screen.findByRole('button', { name: 'Save as tally' })).hasAttribute('disabled')).toBe(false);
    // The only trench item is preselected, and the line says what saving bills (the same function as the server).
    expect((await screen.findByTestId('bill-line')).textContent).toMatch(/^Bills [\d,]+\.\d{2} CY bank to item 3\.10/);
  });

  it('leaves other roles a calculator without Save', async () => {
    renderScreen(false);
    await screen.findByRole('region', { name: 'Result' });
    expect(screen.queryByRole('button', { name: 'Save as tally' })).toBeNull();
    expect(screen.getByText(/Calculator only/)).toBeTruthy();
  });

  it('opens a billed tally read-only: its evidence files listed, no upload, no save, no calculator note', async () => {
    const tally = {
      id: '7d4e2b0a-0000-4000-8000-0000000000aa',
      projectId: 'p1',
      bidItem: {
        id: trenchItem.id,
        itemNumber: '3.10',
        description: 'Trench excavation',
        payUnit: 'CY',
        basis: 'bank',
      },
      measuredOn: '2026-11-10',
      title: 'Road B cut',
      method: 'end-area',
      inputs: {
        unit: 'ft',
        formula: 'average-end-area',
        zeroAreaEnds: 'average',
        stations: [
          { station: 1000, cutArea: 160, fillArea: 0 },
          { station: 1100, cutArea: 160, fillArea: 0 },
        ],
      },
      result: null,
      quantity: 244.4444,
      manualBasis: null,
      sanityReason: null,
      status: 'billed',
      payAppId: null,
      author: { id: 'u1', name: 'Rosa Delgado' },
      evidenceCount: 1,
      createdAt: '2026-11-10T12:00:00Z',
      updatedAt: '2026-11-10T12:00:00Z',
      can: { edit: false, delete: false, markReady: false, addEvidence: false, removeEvidence: false },
    } satisfies WorksheetTally['tally'];
    const evidence = {
      id: 'e1',
      tallyId: tally.id,
      fileName: 'road-b-sections.csv',
      contentType: 'text/csv',
      kind: 'csv',
      sizeBytes: 40,
      sha256: 'a'.repeat(64),
      uploadedBy: 'Rosa Delgado',
      createdAt: '2026-11-10T12:00:00Z',
      downloadUrl: '/api/evidence/e1/download',
    } satisfies WorksheetTally['evidence'][number];
    renderScreen(false, { tally: { tally, evidence: [evidence] } });
    await screen.findByText(/Read-only: the tally/);
    expect(screen.getByRole('link', { name: 'Download road-b-sections.csv' }).getAttribute('href')).toBe(
      '/api/evidence/e1/download',
    );
    expect(screen.queryByText(/Calculator only/)).toBeNull();
    expect(screen.queryByRole('button', { name: /Save/ })).toBeNull();
    // The worksheet's file box is there (read-only), its upload button is not.
    const box = await screen.findByLabelText('Cross sections (CSV or LandXML)');
    expect(box.hasAttribute('readonly')).toBe(true);
    expect(screen.queryByText('Upload file')).toBeNull();
  });
});
