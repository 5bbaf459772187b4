import { existsSync, readdirSync, rmSync, statSync } from 'node:fs';
import path from 'node:path';
import { build, type Plugin } from 'esbuild';

const ROOT = path.resolve(import.meta.dirname, '..');
const OUT_DIR = path.join(ROOT, 'dist-server');
export const SERVER_BUNDLE = path.join(OUT_DIR, 'index.js');
/** The compute pool's worker thread (server/lib/compute/compute-task.ts), bundled beside the server. */
export const COMPUTE_WORKER_BUNDLE = path.join(OUT_DIR, 'compute-task.js');
const SOURCES = [
  'server',
  'src/shared',
  'stripe-standin/src',
  'package-lock.json',
  'tsconfig.json',
  'scripts/build-server.ts',
];

function newestMtime(entry: string): number {
  const stat = statSync(entry);
  if (!stat.isDirectory()) return stat.mtimeMs;
  return Math.max(stat.mtimeMs, ...readdirSync(entry).map((name) => newestMtime(path.join(entry, name))));
}

/**
 * Each module keeps its own `import.meta.url` (its source file's), so the files it finds beside itself (the
 * migrations, the common-password list, fonts through createRequire) resolve as they do under tsx. The URL is
 * worked out at run time from the bundle's own place (the folder above dist-server/) and the source's path
 * relative to the project, so the bundle holds no absolute path of the machine that built it.
 */
const sourceUrls: Plugin = {
  name: 'source-import-meta-url',
  setup(b) {
    b.onLoad({ filter: /\.ts$/ }, async (args) => {
      const { readFile } = await import('node:fs/promises');
      const code = await readFile(args.path, 'utf8');
      const relative = path.relative(ROOT, args.path).split(path.sep).join('/');
      const root = `import.meta.url.slice(0, import.meta.url.lastIndexOf('/${path.basename(OUT_DIR)}/') + 1)`;
      return {
        contents: code.replaceAll('import.meta.url', `new URL(${JSON.stringify(relative)}, ${root}).href`),
        loader: 'ts',
      };
    });
  },
};

/**
 * Bundles the server (our TypeScript: server/, src/shared, the Stripe stand-in) into dist-server/, so
 * `npm start` runs plain node with no TypeScript to transpile at start. npm packages stay external and load from
 * node_modules as usual. Rebuilt when missing or older than its sources.
 */
export async function buildServerIfStale(force = false): Promise<boolean> {
  if (
    !force &&
    existsSync(SERVER_BUNDLE) &&
    statSync(SERVER_BUNDLE).mtimeMs >= Math.max(...SOURCES.map((p) => newestMtime(path.join(ROOT, p))))
  )
    return false;
  console.log('Building the server (dist-server/)...');
  await bundleServer(OUT_DIR);
  return true;
}

/** esbuild into outDir (a folder named dist-server: the bundle finds the project as its parent). */
export async function bundleServer(outDir: string): Promise<void> {
  rmSync(outDir, { recursive: true, force: true });
  await build({
    absWorkingDir: ROOT,
    entryPoints: [
      { in: 'server/index.ts', out: 'index' },
      { in: 'server/lib/compute/compute-task.ts', out: 'compute-task' },
    ],
    // The pool starts the bundled worker (plain JavaScript) instead of the tsx loader it uses under tsx; its place
    // is given relative to the pool's own module, never as this machine's absolute path.
    define: {
      __TALLYARD_COMPUTE_WORKER__: JSON.stringify(
        path
          .relative(path.join(ROOT, 'server/lib/compute'), path.join(outDir, 'compute-task.js'))
          .split(path.sep)
          .join('/'),
      ),
    },
    outdir: outDir,
    // Modules imported with import() (the Stripe stand-in) become chunks of their own, loaded when first used.
    splitting: true,
    chunkNames: 'chunks/[name]-[hash]',
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    packages: 'external',
    sourcemap: 'linked',
    logLevel: 'warning',
    plugins: [sourceUrls],
  });
}

if (import.meta.url === `file://${process.argv[1]}`) await buildServerIfStale(process.argv.includes('--force'));
