import { availableParallelism } from 'node:os';
import { fileURLToPath, URL } from 'node:url';
import { configDefaults, defineConfig } from 'vitest/config';
import { SlowFirstSequencer } from './tests/setup/sequencer';

/**
 * Files that measure how quickly the app answers while it works: they run after all the others, one at a time, so
 * another test file's load on the same cores is not counted against the app.
 */
const ALONE = ['tests/server/compute-responsive.test.ts'];

const resolve = { alias: { '@': fileURLToPath(new URL('./src', import.meta.url)) } };
const shared = {
  environment: 'node',
  testTimeout: 30_000,
  hookTimeout: 60_000,
  pool: 'forks',
} as const;

export default defineConfig({
  resolve,
  test: {
    // Once per run (migrations into a snapshot or a template database), before any file of either project.
    globalSetup: ['tests/setup/global-setup.ts'],
    // Vitest's default (one fewer than the cores) gives a 2-core CI machine a single worker, running every file in
    // turn while the other core idles. Most files wait on a browser, a child process or PGlite's I/O part of the time:
    // two files at once on 2 cores. TEST_WORKERS overrides it (1 runs the files one by one).
    maxWorkers: Number(process.env.TEST_WORKERS) || Math.max(2, availableParallelism() - 1),
    sequence: { sequencer: SlowFirstSequencer },
    projects: [
      {
        resolve,
        test: {
          ...shared,
          setupFiles: ['tests/setup/dom-waits.ts'],
          name: 'tests',
          include: ['tests/**/*.test.ts', 'tests/**/*.test.tsx'],
          exclude: [...configDefaults.exclude, ...ALONE],
        },
      },
      {
        resolve,
        test: { ...shared, name: 'alone', include: ALONE, maxWorkers: 1, sequence: { groupOrder: 1 } },
      },
    ],
  },
});
