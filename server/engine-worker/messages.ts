/** Messages between the request thread and the engine worker. */
import type { RerunResult } from '../../shared/stats/contract';

/** What the worker is asked to run. */
export interface RerunJob {
  plan: unknown;
  /** Raw bytes of the stored data file (CSV or XLSX). */
  data: Uint8Array;
  filename: string;
}

/** Progress, result or error from the worker. */
export type WorkerMessage =
  | { type: 'progress'; fraction: number; stage: string }
  | { type: 'done'; result: RerunResult; timings: { parseMs: number; totalMs: number } }
  | { type: 'error'; name: string; message: string; field?: string };
