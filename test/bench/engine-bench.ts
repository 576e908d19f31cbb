/**
 * Engine benchmark: times the rerun command end to end on generated data
 * (two-way unbalanced between design at 10^4, 10^5, 10^6 rows; 10^3 and 10^4
 * subjects × 6 within levels) and, where Rscript exists, the same analyses in
 * R (read.csv + car::Anova type 3 with sum-to-zero contrasts; afex::aov_ez).
 *
 *   npm run bench:engine            (about 3–5 minutes)
 *   npm run bench:engine -- --quick (10^4 and 10^3 only)
 *
 * "rerun" is the command as the npm script runs it (server/cli/rerun-launcher.mjs:
 * node on an esbuild bundle that is rebuilt only when a source changed; npm's own
 * start-up of about 0.3 s is left out); "via tsx" runs the TypeScript source through
 * tsx, to show how much of the time is start-up.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { makeRandom } from '../../fixtures/seeded-random';

const ROOT = resolve(import.meta.dirname, '../..');
const quick = process.argv.includes('--quick');
const SEED = 918273;

/** Two-way between data, unbalanced: f has 3 levels (probabilities .5/.3/.2), g has 2 (.6/.4). */
function betweenCsv(rows: number, rnd: () => number): string {
  const parts = ['f,g,y\n'];
  const fEffect = [0, 1.5, -1];
  for (let i = 0; i < rows; i++) {
    const u = rnd();
    const f = u < 0.5 ? 0 : u < 0.8 ? 1 : 2;
    const g = rnd() < 0.6 ? 0 : 1;
    const noise = (rnd() + rnd() + rnd() + rnd() - 2) * 6;
    parts.push(`f${f + 1},g${g + 1},${(60 + fEffect[f] + (g ? 0.8 : 0) + (f === 2 && g ? 1.2 : 0) + noise).toFixed(2)}\n`);
  }
  return parts.join('');
}

/** Within data: subjects × 6 time points, long format. */
function withinCsv(subjects: number, rnd: () => number): string {
  const parts = ['id,time,y\n'];
  for (let s = 1; s <= subjects; s++) {
    const person = (rnd() - 0.5) * 20;
    for (let t = 1; t <= 6; t++) parts.push(`S${s},${t},${(50 + person + t * 0.7 + (rnd() + rnd() - 1) * 8).toFixed(2)}\n`);
  }
  return parts.join('');
}

/** Median wall time (seconds) of `runs` executions of a command; throws if it fails. */
function timeCommand(cmd: string, args: string[], runs: number): { median: number; stdout: string } {
  const times: number[] = [];
  let stdout = '';
  for (let r = 0; r < runs; r++) {
    const start = process.hrtime.bigint();
    const out = spawnSync(cmd, args, { cwd: ROOT, encoding: 'utf8', maxBuffer: 256 * 1024 * 1024 });
    const secs = Number(process.hrtime.bigint() - start) / 1e9;
    if (out.status !== 0) throw new Error(`${cmd} ${args.join(' ')} exited ${out.status}: ${out.stderr.trim().split('\n').slice(-3).join(' | ')}`);
    times.push(secs);
    stdout = out.stdout;
  }
  times.sort((a, b) => a - b);
  return { median: times[Math.floor(times.length / 2)], stdout };
}

const hasR = spawnSync('Rscript', ['--version'], { encoding: 'utf8' }).status === 0;
const work = mkdtempSync(join(tmpdir(), 'assayer-bench-'));
const launcher = join(ROOT, 'server/cli/rerun-launcher.mjs');
// Build (or refresh) the bundle once, outside the timings.
spawnSync(process.execPath, [launcher, '--help'], { cwd: ROOT, encoding: 'utf8' });
const tsxCli = join(ROOT, 'node_modules/tsx/dist/cli.mjs');

interface Case {
  label: string;
  rows: number;
  kind: 'between' | 'within';
  csv: string;
  plan: object;
  runs: number;
}
const rnd = makeRandom(SEED);
const cases: Case[] = [];
const betweenPlan = { design: 'anova', outcome: 'y', between: ['f', 'g'], ssType: 3 };
const withinPlan = { design: 'anova', outcome: 'y', within: ['time'], subject: 'id' };
for (const rows of quick ? [1e4] : [1e4, 1e5, 1e6]) {
  cases.push({ label: `between 2-way, ${rows.toExponential(0)} rows`, rows, kind: 'between', csv: betweenCsv(rows, rnd), plan: betweenPlan, runs: rows >= 1e6 ? 3 : 5 });
}
for (const subjects of quick ? [1e3] : [1e3, 1e4]) {
  cases.push({ label: `within 6 levels, ${subjects.toExponential(0)} subjects`, rows: subjects * 6, kind: 'within', csv: withinCsv(subjects, rnd), plan: withinPlan, runs: 3 });
}

console.log(`Engine benchmark (seed ${SEED}); wall-clock medians in seconds; R ${hasR ? 'present' : 'not found'}.`);
console.log(['case', 'rows', 'rerun', 'rows/s', 'via tsx', 'engine parse+compute', 'R total', 'R read+fit', 'rerun/R total'].join('\t'));
try {
  for (const c of cases) {
    const csvPath = join(work, `${c.kind}-${c.rows}.csv`);
    const planPath = join(work, `${c.kind}-${c.rows}.plan.json`);
    writeFileSync(csvPath, c.csv);
    writeFileSync(planPath, JSON.stringify(c.plan));
    const cells: string[] = [c.label, String(c.rows)];
    let ours = NaN;
    try {
      const run = timeCommand(process.execPath, [launcher, '--plan', planPath, '--data', csvPath], c.runs);
      ours = run.median;
      const t = JSON.parse(run.stdout).timings ?? {};
      const viaTsx = timeCommand(process.execPath, [tsxCli, 'server/cli/rerun.ts', '--plan', planPath, '--data', csvPath], c.runs).median;
      cells.push(ours.toFixed(3), Math.round(c.rows / ours).toLocaleString('en-US'), viaTsx.toFixed(3), `${((t.parseMs + t.computeMs) / 1000).toFixed(3)}`);
    } catch (err) {
      cells.push(`failed: ${(err as Error).message}`, '', '', '');
    }
    if (hasR) {
      try {
        const r = timeCommand('Rscript', ['test/bench/r-side.R', c.kind, csvPath], c.rows >= 1e6 ? 2 : 3);
        cells.push(r.median.toFixed(3), Number(r.stdout.trim()).toFixed(3), (ours / r.median).toFixed(2));
      } catch (err) {
        cells.push(`R failed: ${(err as Error).message}`);
      }
    }
    console.log(cells.join('\t'));
  }
} finally {
  rmSync(work, { recursive: true, force: true });
}
