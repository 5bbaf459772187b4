/**
 * Round axis ticks: a step of 1, 2, 2.5 or 5 times a power of ten, chosen so about `target` intervals cover
 * [min, max] (the "nice numbers" idea of Heckbert, Graphics Gems, 1990; from memory). Zero is always inside, so
 * bars start at the axis. Returns the domain to give the axis and its ticks.
 */
export function niceTicks(min: number, max: number, target = 4): { domain: [number, number]; ticks: number[] } {
  const lo = Math.min(0, Number.isFinite(min) ? min : 0);
  const hi = Math.max(0, Number.isFinite(max) ? max : 0);
  if (hi - lo <= 0) return { domain: [0, 1], ticks: [0, 1] };
  const rough = (hi - lo) / target;
  const power = 10 ** Math.floor(Math.log10(rough));
  const step = ([1, 2, 2.5, 5, 10].find((m) => m * power >= rough) ?? 10) * power;
  const start = Math.floor(lo / step) * step;
  const end = Math.ceil(hi / step) * step;
  const ticks: number[] = [];
  // Integer counting avoids drift (0.1 + 0.2); each tick is rounded to the step's own decimals.
  const decimals = Math.max(0, -Math.floor(Math.log10(step)) + 1);
  for (let i = 0; start + i * step <= end + step / 1e9; i++) ticks.push(Number((start + i * step).toFixed(decimals)));
  return { domain: [ticks[0]!, ticks[ticks.length - 1]!], ticks };
}
