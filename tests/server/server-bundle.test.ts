import { readdirSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { bundleServer } from '../../scripts/build-server';

const ROOT = path.resolve(import.meta.dirname, '../..');
// Inside the project, as dist-server/ is (the source maps' relative paths then stay inside it too).
const work = path.join(ROOT, 'node_modules', '.cache', `bundle-test-${process.pid}`);
afterAll(() => rmSync(work, { recursive: true, force: true }));

const filesUnder = (dir: string): string[] =>
  readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? filesUnder(path.join(dir, e.name)) : [path.join(dir, e.name)],
  );

// OWASP ASVS 4.0.3 14.3.2 (no build or debug detail in what is deployed): the bundle is the same on any machine.
describe('the server bundle', () => {
  it("holds no absolute path of the machine that built it (the migrations' and the password list's places are relative)", async () => {
    const out = path.join(work, 'dist-server');
    await bundleServer(out);
    const files = filesUnder(out);
    expect(files.some((f) => f.endsWith('index.js'))).toBe(true);
    for (const file of files) expect(readFileSync(file, 'utf8').includes(ROOT), path.relative(out, file)).toBe(false);
    const code = files
      .filter((f) => f.endsWith('.js'))
      .map((f) => readFileSync(f, 'utf8'))
      .join('\n');
    expect(code).toContain('"server/lib/password-policy.ts"');
  }, 120_000);
});
