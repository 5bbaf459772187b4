const WORDS: Record<string, string> = {
  runs: 'Run',
  loads: 'Line',
  stations: 'Row',
  cornerDepths: 'Corner d',
  depths: 'Grid row',
  bottomWidth: 'bottom width',
  cutArea: 'cut area',
  fillArea: 'fill area',
  capacity: 'capacity',
  count: 'loads',
  station: 'station',
  length: 'length',
  depth: 'depth',
  soilClass: 'Soil class',
  swellPercent: 'Swell',
  shrinkagePercent: 'Shrinkage',
  angleOfReposeDeg: 'Angle of repose',
  bankVolume: 'Bank volume',
  freeHaul: 'Free haul',
  spacingX: 'Node spacing across',
  spacingY: 'Node spacing down',
  sideSlope: 'Side slope',
  existing: 'Existing survey point',
  design: 'Design survey point',
};

/** `runs.0.depth` -> "Run 1 depth": an engine field path in the words of the form. */
export function describePath(path: string): string {
  const parts = path.split('.');
  const out: string[] = [];
  for (const part of parts) {
    if (/^\d+$/.test(part)) out.push(String(Number(part) + 1));
    else out.push(WORDS[part] ?? part);
  }
  return out.join(' ').replace(/^Corner d (\d)/, 'Corner d$1');
}
