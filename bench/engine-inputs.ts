/**
 * Benchmark inputs, built as typed arrays: a borrow pit with an irregular (round) outline and smooth ground,
 * and two scattered point surveys of a 1,000 x 1,000 ft site. Deterministic, so runs compare.
 */
export function roundPitGrid(n: number): Float64Array {
  const v = new Float64Array(n * n);
  for (let r = 0; r < n; r++) {
    for (let c = 0; c < n; c++) {
      const x = c / n;
      const y = r / n;
      const inside = (x - 0.5) ** 2 + (y - 0.5) ** 2 < 0.24;
      v[r * n + c] = inside ? 2 + 3 * Math.sin(6 * x) * Math.cos(4 * y) + 0.3 * Math.sin(40 * x + 13 * y) : NaN;
    }
  }
  return v;
}

export interface Survey {
  x: Float64Array;
  y: Float64Array;
  z: Float64Array;
}

/** n x n shots about 1 ft apart in rows (as a survey comes), jittered by up to 0.3 ft. */
export function survey(n: number, seed: number, height: (x: number, y: number) => number): Survey {
  const count = n * n;
  const x = new Float64Array(count);
  const y = new Float64Array(count);
  const z = new Float64Array(count);
  for (let i = 0, k = 0; i < n; i++) {
    for (let j = 0; j < n; j++, k++) {
      x[k] = 5000 + j + 0.3 * Math.sin((k + seed) * 12.9898);
      y[k] = 8000 + i + 0.3 * Math.cos((k + seed) * 78.233);
      z[k] = height(x[k]! - 5000, y[k]! - 8000);
    }
  }
  return { x, y, z };
}

export function stations(count: number): { station: number; cutArea: number; fillArea: number }[] {
  const out = new Array<{ station: number; cutArea: number; fillArea: number }>(count);
  for (let i = 0; i < count; i++) {
    const wave = Math.sin(i / 37) * 120;
    out[i] = { station: i * 25, cutArea: Math.max(0, wave + 20 * Math.sin(i)), fillArea: Math.max(0, -wave + 15 * Math.cos(i / 3)) };
  }
  return out;
}
