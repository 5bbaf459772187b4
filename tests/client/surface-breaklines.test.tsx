// @vitest-environment jsdom
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { SurfaceWorksheet } from '@/features/worksheets/surface/surface-worksheet';

afterEach(cleanup);

/**
 * Issue 13: a point file's breakline list on the surface worksheet. The existing survey is a kite whose
 * Delaunay diagonal is B-D; listing the breakline A C makes A-C an edge. By the prism method (surveying texts;
 * reference.md section 9: plan area x mean depth) over the design plane z = 0: with B-D, two triangles of 10 sq ft
 * at mean depth 2 ft = 40 cu ft = 1.48 CY; with A-C, at mean depth 1 ft = 20 cu ft = 0.74 CY.
 */
const KITE = 'Point,Northing,Easting,Elevation,Description\nA,0,0,0,toe\nB,-1,10,3,\nC,0,20,0,toe\nD,1,10,3,';
const PLANE = 'x,y,z\n-5,-5,0\n25,-5,0\n25,5,0\n-5,5,0';

describe('breaklines beside a point file', () => {
  it('offers a breakline list for a point file and measures with the breakline kept as an edge', async () => {
    const onInputs = vi.fn();
    render(
      <SurfaceWorksheet
        unit="ft"
        initial={null}
        defaults={{ swellPercent: 0, shrinkagePercent: 0 }}
        onInputs={onInputs}
      />,
    );
    fireEvent.change(screen.getByLabelText('Existing survey (ft)'), { target: { value: KITE } });
    fireEvent.change(screen.getByLabelText('Design survey (ft)'), { target: { value: PLANE } });
    const box = await screen.findByLabelText(/Breaklines of this point file/);
    const lastCut = () => (onInputs.mock.calls.at(-1)?.[1] as { cut: number } | null)?.cut ?? NaN;
    await vi.waitFor(() => expect(lastCut() * 27).toBeCloseTo(40, 9));
    expect(screen.getAllByText('1.48').length).toBeGreaterThan(0);
    fireEvent.change(box, { target: { value: 'A C' } });
    await vi.waitFor(() => expect(lastCut() * 27).toBeCloseTo(20, 9));
    expect(screen.getAllByText('0.74').length).toBeGreaterThan(0);
    expect(screen.getByText(/1 breaklines kept as edges/)).toBeTruthy();
    const [inputs] = onInputs.mock.calls.at(-1)!;
    expect(inputs.existingBreaklines).toEqual([
      [
        [0, 0, 0],
        [20, 0, 0],
      ],
    ]);
    fireEvent.change(box, { target: { value: 'A Z' } });
    await vi.waitFor(() => expect(screen.getByText(/Point Z is not in the point file/)).toBeTruthy());
  });
});
