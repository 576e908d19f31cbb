/**
 * Small helpers for the start and test orchestrators: run a command to completion,
 * start a long-running child, and stop everything on SIGINT/SIGTERM.
 */
import { spawn, type ChildProcess, type SpawnOptions } from 'node:child_process';
import { join } from 'node:path';

/** Absolute path of a binary installed in node_modules/.bin. */
export function bin(name: string): string {
  return join(process.cwd(), 'node_modules', '.bin', name);
}

/** Runs a command, streaming its output, and resolves to its exit code. */
export function runCommand(cmd: string, args: string[], opts: SpawnOptions = {}): Promise<number> {
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { stdio: 'inherit', ...opts });
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 128 : 1)));
    child.on('error', (err) => {
      console.error(`[assayer] could not run ${cmd}: ${err.message}`);
      resolve(127);
    });
  });
}

/** Starts a long-running child and returns it. */
export function startChild(cmd: string, args: string[], opts: SpawnOptions = {}): ChildProcess {
  return spawn(cmd, args, { stdio: 'inherit', ...opts });
}

/** Stops a child with SIGTERM, then SIGKILL after `graceMs`. */
export function stopChild(child: ChildProcess, graceMs = 10_000): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
  return new Promise((resolve) => {
    const timer = setTimeout(() => child.kill('SIGKILL'), graceMs);
    child.once('exit', () => {
      clearTimeout(timer);
      resolve();
    });
    child.kill('SIGTERM');
  });
}

/** Waits until an HTTP URL answers (any status below 500) or the timeout passes. */
export async function waitForHttp(url: string, timeoutMs = 60_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    try {
      const res = await fetch(url);
      if (res.status < 500) return;
    } catch {
      /* not up yet */
    }
    if (Date.now() > deadline) throw new Error(`${url} did not answer within ${timeoutMs / 1000} s`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

/** Registers one clean-up that runs once on SIGINT, SIGTERM or a fatal error. */
export function onShutdown(cleanup: () => Promise<void>): void {
  let done = false;
  const run = async (code: number) => {
    if (done) return;
    done = true;
    try {
      await cleanup();
    } finally {
      process.exit(code);
    }
  };
  process.on('SIGINT', () => void run(130));
  process.on('SIGTERM', () => void run(143));
  process.on('uncaughtException', (err) => {
    console.error(err);
    void run(1);
  });
}

/** Brings the database named in env.DATABASE_URL up to date and, unless `seed` is false, seeds the demo office. */
export async function prepareDatabase(env: NodeJS.ProcessEnv, seed = true): Promise<void> {
  if ((await runCommand(bin('tsx'), ['server/db/migrate.ts'], { env })) !== 0) throw new Error('migrations failed');
  if (seed && (await runCommand(bin('tsx'), ['server/db/seed.ts'], { env })) !== 0) throw new Error('seeding the demo office failed');
}

