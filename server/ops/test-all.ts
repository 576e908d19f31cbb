/**
 * `npm test`: every suite, in order, against throwaway services.
 *
 *   1. type checks (server, shared, tests; the Angular app)
 *   2. engine and server unit suites, R/NIST reference suite, rerun-command suite
 *   3. API integration suite against a throwaway MariaDB on a free port
 *   4. Angular unit suite (ng test)
 *   5. browser suite: production build served on a free port, driven by Chromium
 *
 * The last line is the plain total "N passed, N failed". Set ONLY=unit,api,web,browser
 * to run a subset while developing.
 */
import { mkdirSync, rmSync, existsSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { startMariaDb, type MariaDbHandle } from './mariadb';
import { startFakeSmtp, type FakeSmtpHandle } from './fake-smtp';
import { freePort } from './free-port';
import { bin, prepareDatabase, runCommand, startChild, stopChild, waitForHttp, onShutdown } from './processes';
import type { ChildProcess } from 'node:child_process';

interface Tally {
  suite: string;
  passed: number;
  failed: number;
  skipped: number;
  seconds: number;
}

const tallies: Tally[] = [];
const only = process.env['ONLY']?.split(',').map((s) => s.trim());
const want = (name: string) => !only || only.includes(name);
const runRoot = resolve(process.env['RUN_DIR'] ?? '.run', `test-${process.pid}`);
const reports = join(runRoot, 'reports');

/** Counts from a vitest JSON report; a missing report means the run itself failed. */
function readVitestReport(file: string): { passed: number; failed: number; skipped: number } | null {
  if (!existsSync(file)) return null;
  const r = JSON.parse(readFileSync(file, 'utf8')) as {
    numPassedTests: number;
    numFailedTests: number;
    numPendingTests: number;
    numTodoTests: number;
    testResults: { status: string; assertionResults: unknown[] }[];
  };
  // A test file that fails to load ran no tests: it counts as one failure.
  const brokenFiles = r.testResults.filter((f) => f.status === 'failed' && f.assertionResults.length === 0).length;
  return { passed: r.numPassedTests, failed: r.numFailedTests + brokenFiles, skipped: r.numPendingTests + r.numTodoTests };
}

async function step(suite: string, fn: () => Promise<{ passed: number; failed: number; skipped?: number }>): Promise<void> {
  const t0 = Date.now();
  console.log(`\n[assayer:test] ── ${suite} ──`);
  let result: { passed: number; failed: number; skipped?: number };
  try {
    result = await fn();
  } catch (err) {
    console.error(`[assayer:test] ${suite}: ${(err as Error).message}`);
    result = { passed: 0, failed: 1 };
  }
  const seconds = (Date.now() - t0) / 1000;
  tallies.push({ suite, passed: result.passed, failed: result.failed, skipped: result.skipped ?? 0, seconds });
  console.log(`[assayer:test] ${suite}: ${result.passed} passed, ${result.failed} failed (${seconds.toFixed(1)} s)`);
}

/** A check that is one command (type check, build): one pass or one failure. */
async function commandCheck(cmd: string, args: string[], env: NodeJS.ProcessEnv = process.env) {
  const code = await runCommand(cmd, args, { env });
  return { passed: code === 0 ? 1 : 0, failed: code === 0 ? 0 : 1 };
}

async function vitest(projects: string[], name: string, env: NodeJS.ProcessEnv = process.env) {
  const out = join(reports, `${name}.json`);
  const args = ['run', '--passWithNoTests', '--reporter=default', '--reporter=json', `--outputFile.json=${out}`];
  for (const p of projects) args.push('--project', p);
  const code = await runCommand(bin('vitest'), args, { env });
  const counts = readVitestReport(out);
  if (!counts) return { passed: 0, failed: 1 };
  if (code !== 0 && counts.failed === 0) counts.failed = 1;
  return counts;
}

async function main(): Promise<void> {
  rmSync(runRoot, { recursive: true, force: true });
  mkdirSync(reports, { recursive: true });
  let db: MariaDbHandle | null = null;
  let smtp: FakeSmtpHandle | null = null;
  let server: ChildProcess | null = null;
  const cleanup = async () => {
    if (server) await stopChild(server);
    if (smtp) await smtp.stop();
    if (db) await db.stop();
    if (!process.env['KEEP_TEST_RUN']) rmSync(runRoot, { recursive: true, force: true });
  };
  onShutdown(cleanup);
  const ngEnv = { ...process.env, NG_CLI_ANALYTICS: 'false' };

  if (want('unit')) {
    await step('type check (server, engine, tests)', () => commandCheck(bin('tsc'), ['-p', 'tsconfig.server.json', '--noEmit']));
    await step('engine, server and reference suites', () => vitest(['shared', 'server', 'reference', 'cli'], 'unit'));
  }

  let testEnv: NodeJS.ProcessEnv = process.env;
  if (want('api') || want('browser')) {
    db = await startMariaDb({ dir: join(runRoot, 'mariadb'), log: (l) => console.log(`[assayer:test] ${l}`) });
    smtp = await startFakeSmtp({ dir: join(runRoot, 'mail') });
    testEnv = { ...process.env, SMTP_URL: smtp.url, MAIL_DIR: smtp.dir, RUN_DIR: runRoot, LOG_LEVEL: process.env['LOG_LEVEL'] ?? 'silent', NODE_ENV: 'test' };
  }

  if (want('api') && db) {
    const url = await db.createDatabase('assayer_api');
    await step('API integration suite (MariaDB)', () => vitest(['api'], 'api', { ...testEnv, DATABASE_URL: url }));
  }

  if (want('web')) {
    await step('web app unit suite (ng test)', async () => {
      const out = join(reports, 'web.json');
      const code = await runCommand(bin('ng'), ['test', '--watch=false', '--reporters=json', '--reporters=default', `--output-file=${out}`], { env: ngEnv });
      const counts = readVitestReport(out) ?? { passed: 0, failed: 1, skipped: 0 };
      if (code !== 0 && counts.failed === 0) counts.failed = 1;
      return counts;
    });
  }

  if (want('browser') && db) {
    let built = false;
    await step('production build (ng build)', async () => {
      const r = await commandCheck(bin('ng'), ['build'], ngEnv);
      built = r.failed === 0;
      return r;
    });
    if (built && existsSync('test/browser')) {
      const url = await db.createDatabase('assayer_browser');
      const port = await freePort();
      const env = { ...testEnv, DATABASE_URL: url, PORT: String(port), PUBLIC_URL: `http://127.0.0.1:${port}` };
      await step('browser suite (Chromium)', async () => {
        await prepareDatabase(env);
        server = startChild(bin('tsx'), ['server/main.ts'], { env });
        await waitForHttp(`http://127.0.0.1:${port}/api/health`);
        return vitest(['browser'], 'browser', { ...env, ASSAYER_URL: `http://127.0.0.1:${port}`, BROWSER_DIR: join(runRoot, 'chromium') });
      });
    }
  }

  await cleanup();
  const total = tallies.reduce((a, t) => ({ passed: a.passed + t.passed, failed: a.failed + t.failed, skipped: a.skipped + t.skipped }), { passed: 0, failed: 0, skipped: 0 });
  console.log('\n[assayer:test] summary');
  for (const t of tallies) console.log(`  ${t.failed ? '✗' : '✓'} ${t.suite.padEnd(42)} ${String(t.passed).padStart(5)} passed ${String(t.failed).padStart(4)} failed ${String(t.skipped).padStart(3)} skipped  ${t.seconds.toFixed(1)} s`);
  console.log(`${total.passed} passed, ${total.failed} failed${total.skipped ? `, ${total.skipped} skipped` : ''}`);
  process.exit(total.failed > 0 || total.passed === 0 ? 1 : 0);
}

main().catch((err: Error) => {
  console.error(err);
  console.log('0 passed, 1 failed');
  process.exit(1);
});
