import { isDomainError } from '@/shared/domain/domain-error';
import { depthsFromElevations } from '@/shared/domain/earthwork/grid';
import { parseGridRows, type FileIssue } from '../lib/csv';

export type GridEntry = 'depths' | 'elevations';
type Texts = { depths: string; existing: string; design: string };

const tag = (issues: FileIssue[], what: string) => issues.map((i) => ({ ...i, column: `${what}, ${i.column}` }));

/**
 * Node depths from pasted rows: the depths themselves, or existing minus design elevations (cut positive), to
 * 0.000001 so float noise stays out of the saved inputs.
 */
export function gridDepths(entry: GridEntry, texts: Texts): { depths: (number | null)[][]; issues: FileIssue[] } {
  if (entry === 'depths') return parseGridRows(texts.depths);
  const existing = parseGridRows(texts.existing);
  const design = parseGridRows(texts.design);
  const issues = [...tag(existing.issues, 'existing'), ...tag(design.issues, 'design')];
  if (issues.length) return { depths: [], issues };
  if (existing.depths.length !== design.depths.length) {
    return {
      depths: [],
      issues: [
        {
          line: 0,
          column: '(file)',
          message: `The existing grid has ${existing.depths.length} rows, the design ${design.depths.length}`,
        },
      ],
    };
  }
  try {
    const depths = depthsFromElevations(existing.depths, design.depths).map((row) =>
      row.map((d) => (d === null ? null : Math.round(d * 1e6) / 1e6)),
    );
    return { depths, issues: [] };
  } catch (error) {
    const message = isDomainError(error) ? error.message : String(error);
    return { depths: [], issues: [{ line: 0, column: 'design', message }] };
  }
}
