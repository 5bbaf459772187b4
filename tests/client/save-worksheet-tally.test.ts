import { afterEach, describe, expect, it, vi } from 'vitest';
import { saveWorksheetTally } from '@/features/worksheets/api/save-tally';

afterEach(() => vi.unstubAllGlobals());

// Issue 12, item 4: a tally and its worksheet files go up in one request (the server saves them in one transaction).
describe('saving a worksheet tally with its files', () => {
  it('sends one multipart request: the tally as JSON in `tally`, the files in `files`', async () => {
    const calls: { url: string; init: RequestInit }[] = [];
    vi.stubGlobal(
      'fetch',
      vi.fn(async (url: string, init: RequestInit) => {
        calls.push({ url, init });
        return new Response(JSON.stringify({ tally: { id: 't1' }, evidence: [{ id: 'e1' }] }), { status: 201 });
      }),
    );
    const body = { bidItemId: 'b1', measuredOn: '2026-10-16', method: 'pit' as const, inputs: { depth: 4 } };
    const file = new File(['station,cut_area\n'], 'sections.csv', { type: 'text/csv' });
    const saved = await saveWorksheetTally('p1', { tallyId: null, body, files: [file] });
    expect(calls).toHaveLength(1);
    expect(calls[0]!.url).toBe('/api/projects/p1/tallies');
    expect(calls[0]!.init.method).toBe('POST');
    const form = calls[0]!.init.body as FormData;
    expect(JSON.parse(form.get('tally') as string)).toEqual(body);
    expect((form.getAll('files') as File[]).map((f) => f.name)).toEqual(['sections.csv']);
    expect(saved.evidence).toHaveLength(1);
  });

  it('patches a draft in one request too', async () => {
    const fetchMock = vi.fn(
      async () => new Response(JSON.stringify({ tally: { id: 't1' }, evidence: [] }), { status: 200 }),
    );
    vi.stubGlobal('fetch', fetchMock);
    const file = new File(['x'], 'photo.png', { type: 'image/png' });
    await saveWorksheetTally('p1', { tallyId: 't1', body: { bidItemId: 'b1' } as never, files: [file] });
    expect(fetchMock).toHaveBeenCalledTimes(1);
    expect(fetchMock.mock.calls[0]).toMatchObject(['/api/tallies/t1', { method: 'PATCH' }]);
  });
});
