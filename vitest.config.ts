import { availableParallelism } from 'node:os';
import { fileURLToPath, URL } from 'node:url';
import { defineConfig } from 'vitest/config';
import { SlowFirstSequencer } from './tests/setup/sequencer';

export default defineConfig({
  resolve: {
    alias: { '@': fileURLToPath(new URL('./src', import.meta.url)) },
  },
  test: {
    include: ['tests/**/*.test.ts', 'tests/**/*.test.tsx'],
    environment: 'node',
    globalSetup: ['tests/setup/global-setup.ts'],
    testTimeout: 30_000,
    hookTimeout: 60_000,
    pool: 'forks',
    // Vitest's default (one fewer than the cores) gives a 2-core CI machine a single worker, running every file in
    // turn while the other core idles. Most files wait on a browser, a child process or PGlite's I/O part of the time:
    // two files at once on 2 cores. TEST_WORKERS overrides it (1 runs the files one by one).
    maxWorkers: Number(process.env.TEST_WORKERS) || Math.max(2, availableParallelism() - 1),
    sequence: { sequencer: SlowFirstSequencer },
  },
});
