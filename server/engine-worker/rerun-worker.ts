/**
 * Worker-thread entry: runs the statistics engine on one plan and dataset, off
 * the request thread, posting progress messages and then the result.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { runPlan } from '../../shared/stats/rerun';
import { readTableBytes } from '../tabular/index';
import type { WorkerMessage, RerunJob } from './messages';

const job = workerData as RerunJob;
const post = (m: WorkerMessage) => parentPort!.postMessage(m);

try {
  const t0 = performance.now();
  post({ type: 'progress', fraction: 0.02, stage: 'reading data' });
  const table = await readTableBytes(job.data, job.filename);
  const parseMs = performance.now() - t0;
  const result = runPlan(job.plan, table, { onProgress: (fraction, stage) => post({ type: 'progress', fraction: 0.1 + 0.9 * fraction, stage }) });
  post({ type: 'done', result, timings: { parseMs, totalMs: performance.now() - t0 } });
} catch (err) {
  const e = err as Error & { field?: string };
  post({ type: 'error', name: e.name, message: e.message, field: e.field });
}
