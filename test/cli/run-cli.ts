/**
 * Helpers for driving the rerun command as a child process, the way office
 * scripts call it, with plans and data written to a fresh temporary folder.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';

/** Repository root. */
export const ROOT = resolve(import.meta.dirname, '../..');
const tsxCli = join(ROOT, 'node_modules/tsx/dist/cli.mjs');

/** Outcome of one command run. */
export interface CliRun {
  code: number | null;
  stdout: string;
  stderr: string;
}

/** Runs `rerun` with raw arguments through tsx, straight from the TypeScript source. */
export function runCli(args: string[], cwd = ROOT): CliRun {
  const r = spawnSync(process.execPath, [tsxCli, join(ROOT, 'server/cli/rerun.ts'), ...args], { cwd, encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** Runs `npm run --silent rerun -- ...` exactly as documented. */
export function runNpm(args: string[]): CliRun {
  const r = spawnSync('npm', ['run', '--silent', 'rerun', '--', ...args], { cwd: ROOT, encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** A temporary folder for one test file; `cleanup` removes it. */
export function tempDir(): { dir: string; file: (name: string, content: string | Uint8Array) => string; cleanup: () => void } {
  const dir = mkdtempSync(join(tmpdir(), 'assayer-cli-'));
  return {
    dir,
    file: (name, content) => {
      const path = join(dir, name);
      writeFileSync(path, content);
      return path;
    },
    cleanup: () => rmSync(dir, { recursive: true, force: true }),
  };
}

/** Writes a plan and a CSV and runs the command on them. */
export function rerunWith(tmp: ReturnType<typeof tempDir>, plan: unknown, csv: string, name = 'case'): CliRun {
  const planPath = tmp.file(`${name}.plan.json`, typeof plan === 'string' ? plan : JSON.stringify(plan));
  const dataPath = tmp.file(`${name}.csv`, csv);
  return runCli(['--plan', planPath, '--data', dataPath]);
}
