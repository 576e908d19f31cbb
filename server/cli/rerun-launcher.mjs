// Starts the rerun command from a bundle of its TypeScript sources.
//
// Plain JavaScript on purpose: loading a TypeScript loader (tsx) costs about half a
// second of start-up on every call, which office scripts that rerun many plans pay
// each time. This launcher rebuilds dist/cli/rerun.mjs with esbuild only when a source
// file is newer than the bundle, then runs it in the same process.
import { existsSync, mkdirSync, readdirSync, renameSync, statSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const bundle = join(root, 'dist', 'cli', 'rerun.mjs');
const sourceDirs = ['server/cli', 'server/tabular', 'shared/stats'].map((d) => join(root, d));

/** Newest modification time of the .ts files below a folder. */
function newest(dir) {
  let max = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, entry.name);
    if (entry.isDirectory()) max = Math.max(max, newest(p));
    else if (entry.name.endsWith('.ts')) max = Math.max(max, statSync(p).mtimeMs);
  }
  return max;
}

const builtAt = existsSync(bundle) ? statSync(bundle).mtimeMs : 0;
if (sourceDirs.some((d) => newest(d) > builtAt)) {
  const { build } = await import('esbuild');
  mkdirSync(dirname(bundle), { recursive: true });
  // Build beside the bundle and rename, so two commands started together never read half a file.
  const tmp = `${bundle}.${process.pid}.tmp.mjs`;
  await build({
    entryPoints: [join(root, 'server/cli/rerun.ts')],
    outfile: tmp,
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    packages: 'external',
    logLevel: 'error',
  });
  renameSync(tmp, bundle);
}
await import(pathToFileURL(bundle).href);
