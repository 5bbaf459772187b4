import { dualLength, limit } from './trench-slopes';
import type { TrenchInput, TrenchRunResult } from './trench';

function runList(indices: number[]): string {
  const shown = indices.slice(0, 10).map((i) => i + 1).join(', ');
  return `${indices.length === 1 ? 'Run' : 'Runs'} ${shown}${indices.length > 10 ? ` and ${indices.length - 10} more` : ''}`;
}

/** Safety cautions for a trench worksheet, in the order a reader needs them. */
export function trenchCautions(input: TrenchInput, runs: readonly TrenchRunResult[]): string[] {
  const { unit } = input;
  const protective = limit('protectiveSystemDepth', unit);
  const engineer = limit('engineerDepth', unit);
  const deep = runs.flatMap((r, i) => (r.depth >= protective ? [i] : []));
  const tooDeep = runs.flatMap((r, i) => (r.depth >= engineer ? [i] : []));
  const cautions = [
    'Planning aid only: protective systems follow 29 CFR 1926 Subpart P, the governing local code and a competent person on site.',
  ];
  if (deep.length > 0) {
    cautions.push(
      `${runList(deep)} ${deep.length === 1 ? 'is' : 'are'} ${dualLength('protectiveSystemDepth', unit)} deep or more: a protective system is required unless the excavation is entirely in stable rock (1926.652(a)(1)).`,
    );
  }
  if (deep.length < runs.length) {
    cautions.push(`Shallower than ${dualLength('protectiveSystemDepth', unit)}: still protect it if a competent person finds signs of a potential cave-in (1926.652(a)(1)).`);
  }
  if (tooDeep.length > 0) {
    cautions.push(
      `${runList(tooDeep)} ${tooDeep.length === 1 ? 'is' : 'are'} ${dualLength('engineerDepth', unit)} deep or more, beyond Table B-1: sloping, benching or shoring must be designed by a registered professional engineer (1926.652(b)(4)).`,
    );
  }
  if (input.protection === 'box') cautions.push('Trench box: use it within the manufacturer\'s tabulated data (1926.652(c)(2)).');
  cautions.push(`Keep spoil and equipment at least ${dualLength('spoilSetback', unit)} from the edge (1926.651(j)(2)).`);
  return cautions;
}
