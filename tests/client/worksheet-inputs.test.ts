import { describe, expect, it } from 'vitest';
import { computeCalc, friendly } from '../../src/features/worksheets/lib/live-calc';
import { notTextReason } from '../../src/features/worksheets/lib/worksheet-files';
import { readTypedNumber } from '../../src/shared/parse-number';

describe('worksheet inputs say what is wrong and where', () => {
  it('reads thousands separators and keeps text that is not a number as text', () => {
    expect(readTypedNumber('2,849.78')).toBe(2849.78);
    expect(readTypedNumber(' 12 ')).toBe(12);
    expect(readTypedNumber('abc')).toBe('abc');
    expect(readTypedNumber('1e12')).toBe('1e12');
    expect(readTypedNumber('1,2345')).toBe('1,2345');
    expect(readTypedNumber('')).toBeNaN();
  });

  it('tells "not a number" from an empty box, and a too-large number by its limit', () => {
    const pit = (sideSlope: unknown, length: unknown = 40) =>
      computeCalc('pit', { unit: 'ft', length, width: 30, cornerDepths: [5, 5, 5, 5], sideSlope });
    expect(pit('abc').issues).toEqual([{ path: 'sideSlope', message: 'Not a number' }]);
    expect(computeCalc('pit', { unit: 'ft', length: null, width: 30, cornerDepths: [5, 5, 5, 5] }).issues).toEqual([
      { path: 'length', message: 'Enter a number' },
    ]);
    expect(pit(0, 1e12).issues[0]).toEqual({
      path: 'length',
      message: expect.stringMatching(/^Must be at most [\d,]+$/),
    });
    expect(friendly({ path: 'x', message: 'Too big: expected number to be <=1000' })).toEqual({
      path: 'x',
      message: 'Must be at most 1,000',
    });
  });

  it('names a station typed twice by its station and both rows: "Station 2+40 appears twice, in rows 2 and 3"', () => {
    const stations = [
      { station: 200, cutArea: 10, fillArea: 0 },
      { station: 240, cutArea: 12, fillArea: 0 },
      { station: 240, cutArea: 14, fillArea: 0 },
    ];
    expect(computeCalc('end-area', { unit: 'ft', stations }).issues).toEqual([
      { path: 'stations.2.station', message: 'Station 2+40.00 appears twice, in rows 2 and 3' },
    ]);
  });

  it('refuses a file that is not text before it reaches the form: a PNG, UTF-16, binary', async () => {
    const png = new File([new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0])], 'photo.csv');
    expect(await notTextReason(png)).toMatch(/photo\.csv is a PNG image, not a text file/);
    expect(await notTextReason(new File([new Uint8Array([0xff, 0xfe, 0x41, 0])], 'u16.csv'))).toMatch(/UTF-16/);
    expect(await notTextReason(new File(['x,y,z\n1,2,3\n'], 'points.csv'))).toBeNull();
  });
});
