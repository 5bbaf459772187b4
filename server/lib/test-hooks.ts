import { existsSync } from 'node:fs';

/**
 * Test-only (NODE_ENV=test and TALLYARD_TEST_BLOCK_FILE set): on SIGUSR2 the process holds its event loop in a busy
 * wait for as long as that file exists, as a long synchronous computation would. The data folder lock test uses it
 * to show that a busy server keeps its lock.
 */
export function installTestHooks(env: { NODE_ENV: string }): void {
  const blockFile = process.env.TALLYARD_TEST_BLOCK_FILE;
  if (env.NODE_ENV !== 'test' || !blockFile) return;
  process.on('SIGUSR2', () => {
    console.log('test hook: event loop blocked');
    while (existsSync(blockFile)) {
      const until = Date.now() + 10;
      while (Date.now() < until) {
        // busy: nothing else runs on this thread
      }
    }
  });
}
