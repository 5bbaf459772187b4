import { readFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';
import { check, type SelfMeasuredBench } from '../types';
import { DIST, ensureBuilt } from './built';

const LIMIT_KB = 150;

/** The entry script of dist/index.html and every module it imports statically, transitively (not lazy ones). */
export function initialScripts(): string[] {
  const html = readFileSync(path.join(DIST, 'index.html'), 'utf8');
  const entry = /<script[^>]+type="module"[^>]+src="([^"]+)"/.exec(html)?.[1];
  if (!entry) throw new Error('dist/index.html has no module script');
  const seen = new Set<string>();
  const visit = (rel: string) => {
    const file = path.join(DIST, rel.replace(/^\//, ''));
    if (seen.has(file)) return;
    seen.add(file);
    const code = readFileSync(file, 'utf8');
    // Static imports only: `import ... from "./x.js"`, `import "./x.js"`, `export ... from "./x.js"`.
    for (const m of code.matchAll(/(?:^|[;\n}])\s*(?:import|export)\s*(?:[\w*{}\s,$]+from\s*)?["'](\.\/[^"']+\.js)["']/g)) {
      visit(path.posix.join(path.posix.dirname(rel), m[1]!));
    }
  };
  visit(entry);
  return [...seen];
}

export const clientBundle: SelfMeasuredBench = {
  name: 'client-initial-js-gzip',
  async measure() {
    await ensureBuilt();
    const files = initialScripts();
    const bytes = files.reduce((sum, f) => sum + gzipSync(readFileSync(f), { level: 9 }).length, 0);
    const raw = files.reduce((sum, f) => sum + readFileSync(f).length, 0);
    return {
      checks: [check('initial JS gzip', bytes / 1024, 'kB', '<=', LIMIT_KB)],
      baseline: `the entry script of dist/index.html and its static imports (${files.length} files), gzip level 9`,
      figures: { gzipBytes: bytes, rawBytes: raw, files: files.length },
    };
  },
};
