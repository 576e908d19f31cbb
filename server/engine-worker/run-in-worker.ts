/**
 * Runs engine jobs in worker threads, never on the request thread, at most
 * `maxConcurrent` at a time (one per core by default); further jobs wait in a queue.
 */
import { Worker } from 'node:worker_threads';
import { availableParallelism } from 'node:os';
import type { RerunResult } from '../../shared/stats/contract';
import { InputError } from '../../shared/stats/contract';
import type { RerunJob, WorkerMessage } from './messages';

/** Outcome of one job. */
export interface WorkerOutcome {
  result: RerunResult;
  timings: { parseMs: number; totalMs: number; queuedMs: number };
}

/** Progress callback: fraction 0–1 and a short stage name. */
export type ProgressFn = (fraction: number, stage: string) => void;

const workerUrl = new URL('./rerun-worker.ts', import.meta.url);
/**
 * The worker's entry is TypeScript. On Node 20 a worker started with
 * `execArgv: ['--import', 'tsx']` still cannot load a .ts entry (ERR_UNKNOWN_FILE_EXTENSION),
 * so the worker starts from a one-line module that registers tsx's loader inside the
 * worker and then imports the real entry.
 */
const bootstrap = `import(${JSON.stringify(import.meta.resolve('tsx/esm/api'))}).then((m) => { m.register(); return import(${JSON.stringify(workerUrl.href)}); })`;
const maxConcurrent = Math.max(1, Number(process.env['ENGINE_WORKERS'] ?? availableParallelism()));
let running = 0;
const waiting: (() => void)[] = [];

async function slot(): Promise<() => void> {
  if (running >= maxConcurrent) await new Promise<void>((r) => waiting.push(r));
  running++;
  return () => {
    running--;
    waiting.shift()?.();
  };
}

/** Number of jobs running and queued (for health and progress messages). */
export function engineLoad(): { running: number; queued: number; capacity: number } {
  return { running, queued: waiting.length, capacity: maxConcurrent };
}

/**
 * Runs one rerun job in a worker. Rejects with InputError for invalid plans or data
 * (message names the field, column or row) and with Error for anything else.
 */
export async function runInWorker(job: RerunJob, onProgress?: ProgressFn, timeoutMs = 10 * 60_000): Promise<WorkerOutcome> {
  const queuedAt = performance.now();
  onProgress?.(0, 'queued');
  const release = await slot();
  const queuedMs = performance.now() - queuedAt;
  try {
    return await new Promise<WorkerOutcome>((resolve, reject) => {
      const worker = new Worker(bootstrap, { eval: true, workerData: job });
      const timer = setTimeout(() => {
        void worker.terminate();
        reject(new Error(`The rerun took longer than ${Math.round(timeoutMs / 1000)} s and was stopped.`));
      }, timeoutMs);
      worker.on('message', (m: WorkerMessage) => {
        if (m.type === 'progress') onProgress?.(m.fraction, m.stage);
        else if (m.type === 'done') {
          clearTimeout(timer);
          resolve({ result: m.result, timings: { ...m.timings, queuedMs } });
          void worker.terminate();
        } else {
          clearTimeout(timer);
          reject(m.name === 'InputError' ? new InputError(m.field ?? 'data', m.message) : new Error(m.message));
          void worker.terminate();
        }
      });
      worker.on('error', (err) => {
        clearTimeout(timer);
        reject(err);
      });
      worker.on('exit', (code) => {
        clearTimeout(timer);
        if (code !== 0) reject(new Error(`The engine worker stopped unexpectedly (exit ${code}).`));
      });
    });
  } finally {
    release();
  }
}
