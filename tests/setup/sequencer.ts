import { statSync } from 'node:fs';
import { relative } from 'node:path';
import { BaseSequencer, type TestSpecification } from 'vitest/node';

/** Slowest kinds of file first: browser tests, then the servers in child processes, then the API, then the rest. */
const WEIGHTS: [RegExp, number][] = [
  [/^tests\/e2e\//, 0],
  [/^tests\/server\//, 1],
  [/^tests\/api\//, 2],
];

/**
 * The order files start in. With a timing from an earlier run for every file (vitest's cache), vitest's own order:
 * the longest first. Without (a fresh clone, as on CI), vitest would start the largest files first, so a short file
 * that runs long (a browser test walking every screen) could start last and leave one worker running on its own;
 * here the kinds of file that run long start first, the largest of each kind first.
 */
export class SlowFirstSequencer extends BaseSequencer {
  override async sort(files: TestSpecification[]): Promise<TestSpecification[]> {
    const root = this.ctx.config.root;
    const key = (f: TestSpecification) => `${f.project.name}:${relative(root, f.moduleId)}`;
    if (files.every((f) => this.ctx.cache.getFileTestResults(key(f)))) return super.sort(files);
    const weight = (f: TestSpecification) => WEIGHTS.find(([re]) => re.test(relative(root, f.moduleId)))?.[1] ?? 3;
    const size = (f: TestSpecification) => statSync(f.moduleId).size;
    return [...files].sort((a, b) => weight(a) - weight(b) || size(b) - size(a));
  }
}
