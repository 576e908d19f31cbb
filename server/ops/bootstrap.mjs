// Entry point of `npm start` and `npm test` on a fresh machine.
//
// Plain JavaScript on purpose: it runs before node_modules exists, so it can use
// nothing but Node itself. It installs what is missing (Debian packages, npm
// dependencies) and hands over to the TypeScript orchestrators through tsx.
import { spawnSync, spawn } from 'node:child_process';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { join, dirname } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const mode = process.argv[2];
if (mode !== 'start' && mode !== 'test') {
  console.error('usage: node server/ops/bootstrap.mjs start|test');
  process.exit(2);
}

/** Debian packages and the file each provides. */
const aptNeeds = [
  { pkg: 'mariadb-server', file: '/usr/sbin/mariadbd', for: ['start', 'test'] },
  { pkg: 'mariadb-client', file: '/usr/bin/mariadb-admin', for: ['start', 'test'] },
  { pkg: 'chromium', file: '/usr/bin/chromium', for: ['test'] },
  { pkg: 'poppler-utils', file: '/usr/bin/pdftoppm', for: ['test'] },
  { pkg: 'openssl', file: '/usr/bin/openssl', for: ['test'] },
];

function say(line) {
  console.log(`[assayer] ${line}`);
}

function ensureAptPackages() {
  const missing = aptNeeds.filter((n) => n.for.includes(mode) && !existsSync(n.file)).map((n) => n.pkg);
  if (missing.length === 0) return;
  if (process.getuid && process.getuid() !== 0) {
    console.error(`[assayer] Missing Debian packages: ${missing.join(' ')}. Install them as root: apt-get update && apt-get install -y ${missing.join(' ')}`);
    process.exit(1);
  }
  say(`installing Debian packages: ${missing.join(' ')}`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  let r = spawnSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  if (r.status !== 0) process.exit(r.status ?? 1);
  r = spawnSync('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...missing], { stdio: 'inherit', env });
  if (r.status !== 0) {
    console.error('[assayer] apt-get install failed; see the messages above.');
    process.exit(r.status ?? 1);
  }
}

function lockHash() {
  return createHash('sha256').update(readFileSync(join(root, 'package-lock.json'))).digest('hex');
}

function ensureNodeModules() {
  const stamp = join(root, 'node_modules', '.assayer-lock-sha256');
  const want = lockHash();
  if (existsSync(stamp) && readFileSync(stamp, 'utf8').trim() === want && existsSync(join(root, 'node_modules', '.bin', 'tsx'))) return;
  say(existsSync(join(root, 'node_modules')) ? 'package-lock.json changed: running npm ci' : 'installing npm dependencies (npm ci)');
  const r = spawnSync('npm', ['ci', '--no-audit', '--no-fund', '--loglevel=error'], { cwd: root, stdio: 'inherit' });
  if (r.status !== 0) {
    console.error('[assayer] npm ci failed; see the messages above.');
    process.exit(r.status ?? 1);
  }
  writeFileSync(stamp, want + '\n');
}

ensureAptPackages();
ensureNodeModules();

const script = mode === 'start' ? 'server/ops/start.ts' : 'server/ops/test-all.ts';
const child = spawn(join(root, 'node_modules', '.bin', 'tsx'), [join(root, script), ...process.argv.slice(3)], {
  cwd: root,
  stdio: 'inherit',
});
for (const sig of ['SIGINT', 'SIGTERM']) {
  process.on(sig, () => child.kill(sig));
}
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
