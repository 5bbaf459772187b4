// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { inputChanges, InputsSummary } from '@/features/tallies/components/inputs-summary';

afterEach(cleanup);

const texts = (cells: HTMLElement[]) => cells.map((c) => c.textContent);

describe('the inputs of a tally as a person reads them', () => {
  it('shows cross sections with stations in station notation, columns in worksheet order, units and words', () => {
    render(
      <InputsSummary
        inputs={{
          zeroAreaEnds: 'average',
          unit: 'ft',
          formula: 'average-end-area',
          stations: [
            { fillArea: 0, cutArea: 160, station: 1000 },
            { fillArea: 12.5, cutArea: 160, station: 1125.5 },
          ],
        }}
      />,
    );
    const table = screen.getByRole('table', { name: 'Stations' });
    expect(texts(within(table).getAllByRole('columnheader'))).toEqual([
      'Station',
      'Cut area (sq ft)',
      'Fill area (sq ft)',
    ]);
    // 100 ft stations (common practice): 1,125.5 ft is 11+25.50.
    expect(texts(within(table).getAllByRole('cell'))).toEqual(['10+00.00', '160', '0', '11+25.50', '160', '12.5']);
    expect(screen.getByText('Average end area')).toBeTruthy();
    expect(screen.getByText('Average the ends')).toBeTruthy();
    expect(screen.queryByText(/average-end-area/)).toBeNull();
  });

  it('puts truck capacity before loads, and a pit length before its width with the unit', () => {
    render(
      <InputsSummary
        inputs={{
          unit: 'ft',
          width: 12,
          length: 16,
          loads: [{ count: 10, capacity: 14 }],
        }}
      />,
    );
    const table = screen.getByRole('table', { name: 'Truck loads' });
    expect(texts(within(table).getAllByRole('columnheader'))).toEqual(['Truck capacity (loose CY)', 'Loads']);
    const terms = texts(screen.getAllByRole('term'));
    expect(terms).toEqual(['Length unit', 'Length', 'Width']);
    expect(texts(screen.getAllByRole('definition'))).toEqual(['feet', '16 ft', '12 ft']);
  });

  it('says what a later save changed: a pit 16 ft long made 18 ft; stations added; nothing when equal', () => {
    const pit = { unit: 'ft', length: 16, width: 12, cornerDepths: [5, 5, 5, 5] };
    expect(inputChanges(pit, { ...pit, length: 18 })).toEqual(['Length 16 ft → 18 ft']);
    expect(inputChanges(pit, pit)).toEqual([]);
    const s = (n: number) =>
      Array.from({ length: n }, (_, i) => ({ station: 1000 + 100 * i, cutArea: 160, fillArea: 0 }));
    expect(inputChanges({ unit: 'ft', stations: s(2) }, { unit: 'ft', stations: s(3) })).toEqual([
      'Stations: 2 rows → 3 rows',
    ]);
    expect(inputChanges({ unit: 'ft', formula: 'average-end-area' }, { unit: 'ft', formula: 'prismoidal' })).toEqual([
      'Formula Average end area → Prismoidal',
    ]);
    expect(inputChanges({ a: 1, b: 1, c: 1, d: 1 }, { a: 2, b: 2, c: 2, d: 2 }, 2)).toEqual([
      'A 1 → 2',
      'B 1 → 2',
      'and 2 more',
    ]);
  });
});
