import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { runInWorker } from './run-in-worker';
import { InputError } from '../../shared/stats/contract';
import { rerunFromText } from '../../shared/stats/rerun';

// The worker must give exactly what the engine gives on the calling thread, report progress,
// and turn the engine's input errors back into InputError with their field.
describe('runInWorker', () => {
  const csv = readFileSync('fixtures/demo/course-modality.csv');
  const plan = JSON.parse(readFileSync('fixtures/demo/course-modality.plan.json', 'utf8')) as Record<string, unknown>;

  it('runs the engine in a worker thread with progress and the same result as in-process', async () => {
    const stages: string[] = [];
    const out = await runInWorker({ plan, data: new Uint8Array(csv), filename: 'course-modality.csv' }, (_f, stage) => stages.push(stage));
    const direct = rerunFromText(plan, csv.toString('utf8'));
    const strip = (r: object) => JSON.stringify({ ...r, timings: undefined });
    expect(strip(out.result)).toBe(strip(direct));
    expect(stages[0]).toBe('queued');
    expect(stages.length).toBeGreaterThan(2);
    expect(out.timings.totalMs).toBeGreaterThan(0);
  }, 60_000);

  it('reports invalid input as InputError naming the field', async () => {
    const bad = { ...plan, outcome: 'no_such_column' };
    await expect(runInWorker({ plan: bad, data: new Uint8Array(csv), filename: 'course-modality.csv' })).rejects.toSatisfy(
      (e: unknown) => e instanceof InputError && /no_such_column/.test((e as Error).message),
    );
  }, 60_000);
});
