import Papa from 'papaparse';

/** A problem in an uploaded or pasted file: where (line, column) and why. */
export type FileIssue = { line: number; column: string; message: string };

export type CsvRow = { line: number; cells: string[] };

/** Non-blank rows with their 1-based line numbers (papaparse keeps quoted commas and line breaks right). */
export function csvRows(text: string): CsvRow[] {
  const parsed = Papa.parse<string[]>(text.trim(), { skipEmptyLines: false, delimitersToGuess: [',', '\t', ';', ' '] });
  const rows: CsvRow[] = [];
  parsed.data.forEach((cells, i) => {
    const trimmed = cells.map((c) => c.trim());
    if (trimmed.some((c) => c !== '')) rows.push({ line: i + 1, cells: trimmed });
  });
  return rows;
}

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)(e[+-]?\d+)?$/i;

/** A plain decimal number ("12.5", "-3", "1e3"); station text "12+50" is read as 1250. */
export function readNumber(cell: string): number | null {
  const s = cell.replace(/,/g, '');
  const station = /^(\d+)\+(\d+(\.\d*)?)$/.exec(s);
  if (station) return Number(station[1]) * (station[2]!.split('.')[0]!.length === 3 ? 1000 : 100) + Number(station[2]);
  return NUMBER.test(s) ? Number(s) : null;
}

/** True when a first row is a header: none of its cells is a number (so a typo in a data row is reported). */
export function isHeader(row: CsvRow | undefined): boolean {
  return (
    row !== undefined && row.cells.every((c) => readNumber(c) === null) && row.cells.some((c) => c !== '' && c !== '-')
  );
}

/**
 * Rows of exactly `columns.length` numbers (x, y, z ...). A header row is skipped. Each bad cell is reported
 * with its line and column name; at most `maxIssues` are listed.
 */
export function parseNumberTable(text: string, columns: readonly string[], maxIssues = 50) {
  const rows = csvRows(text);
  const body = isHeader(rows[0]) ? rows.slice(1) : rows;
  const values: number[][] = [];
  const issues: FileIssue[] = [];
  for (const row of body) {
    if (issues.length >= maxIssues) break;
    if (row.cells.length !== columns.length) {
      issues.push({
        line: row.line,
        column: '(row)',
        message: `Expected ${columns.length} values (${columns.join(', ')}), found ${row.cells.length}`,
      });
      continue;
    }
    const nums = row.cells.map((cell, k) => {
      const n = readNumber(cell);
      if (n === null)
        issues.push({
          line: row.line,
          column: columns[k]!,
          message: cell === '' ? 'Empty' : `"${cell}" is not a number`,
        });
      return n;
    });
    if (nums.every((n) => n !== null)) values.push(nums as number[]);
  }
  if (body.length === 0) issues.push({ line: 1, column: '(file)', message: 'No data rows' });
  return { values, issues };
}

/** Rows of node depths for a grid; an empty cell or "-" is a node outside the outline (null). */
export function parseGridRows(text: string, maxIssues = 50) {
  const rows = csvRows(text);
  const body = isHeader(rows[0]) ? rows.slice(1) : rows;
  const depths: (number | null)[][] = [];
  const issues: FileIssue[] = [];
  for (const row of body) {
    depths.push(
      row.cells.map((cell, k) => {
        if (cell === '' || cell === '-') return null;
        const n = readNumber(cell);
        if (n === null && issues.length < maxIssues)
          issues.push({ line: row.line, column: `node ${k + 1}`, message: `"${cell}" is not a depth` });
        return n;
      }),
    );
  }
  const cols = depths[0]?.length ?? 0;
  body.forEach((row, i) => {
    if (depths[i]!.length !== cols && issues.length < maxIssues) {
      issues.push({
        line: row.line,
        column: '(row)',
        message: `${depths[i]!.length} nodes; the first row has ${cols}`,
      });
    }
  });
  return { depths, issues };
}
