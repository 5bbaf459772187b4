import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

// Calculation trails are printed in pay documents and on screen: they cite a source plainly ("OSHA 29 CFR 1926
// Subpart P App. B", "common practice"). Where a value was written from memory, that note stays in a code comment
// and in the test that checks it (issue 14, item 6), never in the text people read.
const ROOTS = ['src/shared', 'src/features', 'src/components', 'src/app', 'server/modules'];

function files(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const full = path.join(dir, e.name);
    if (e.isDirectory()) return files(full);
    return /\.tsx?$/.test(e.name) ? [full] : [];
  });
}

/** The line without its comment: a `//` after code, or a whole comment line. */
function codeOf(line: string): string {
  const trimmed = line.trim();
  if (trimmed.startsWith('//') || trimmed.startsWith('*') || trimmed.startsWith('/*')) return '';
  const cut = line.search(/\s\/\/\s/);
  return cut === -1 ? line : line.slice(0, cut);
}

describe('citations in the shown text are plain', () => {
  it('no string outside comments says "from memory"', () => {
    const found: string[] = [];
    for (const root of ROOTS) {
      for (const file of files(root)) {
        readFileSync(file, 'utf8')
          .split('\n')
          .forEach((line, i) => {
            if (/from memory/i.test(codeOf(line))) found.push(`${file}:${i + 1}`);
          });
      }
    }
    expect(found).toEqual([]);
  });
});
