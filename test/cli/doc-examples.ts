/**
 * The worked examples of docs/rerun-contract.md: which demo plan each one
 * runs, and how a result is cut down to the excerpt the page shows. Run this
 * file to rewrite the examples from the command's current output:
 *
 *   npx tsx test/cli/doc-examples.ts
 *
 * test/cli/docs-examples.test.ts checks that the page still matches.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ROOT, runCli } from './run-cli';

/** One worked example: a demo plan and its data file. */
export interface DocExample {
  name: string;
  plan: string;
  data: string;
}

/** The examples, one per design (anova appears as between, repeated and mixed). */
export const DOC_EXAMPLES: DocExample[] = [
  { name: 'one-sample', plan: 'fixtures/demo/advising-pilot.one-sample.plan.json', data: 'fixtures/demo/advising-pilot.csv' },
  { name: 'independent', plan: 'fixtures/demo/advising-pilot.independent.plan.json', data: 'fixtures/demo/advising-pilot.csv' },
  { name: 'paired', plan: 'fixtures/demo/writing-lab.plan.json', data: 'fixtures/demo/writing-lab.csv' },
  { name: 'anova-one-way', plan: 'fixtures/demo/advising-pilot.plan.json', data: 'fixtures/demo/advising-pilot.csv' },
  { name: 'anova-two-way', plan: 'fixtures/demo/course-modality.plan.json', data: 'fixtures/demo/course-modality.csv' },
  { name: 'anova-repeated', plan: 'fixtures/demo/belonging-survey.plan.json', data: 'fixtures/demo/belonging-survey.csv' },
  { name: 'anova-mixed', plan: 'fixtures/demo/peer-tutoring.plan.json', data: 'fixtures/demo/peer-tutoring.csv' },
  { name: 'regression', plan: 'fixtures/demo/advising-pilot.regression.plan.json', data: 'fixtures/demo/advising-pilot.csv' },
];

/** Fields left out of the page: run-dependent (timings) or too long to read (Q-Q points). */
const OMIT = new Set(['timings', 'qq']);
/** Long lists are cut to their first rows on the page. */
const MAX_ROWS = 3;

/** Rounds to 6 significant digits for display. */
function round(v: unknown): unknown {
  if (typeof v === 'number') return Number.isInteger(v) ? v : Number(v.toPrecision(6));
  if (Array.isArray(v)) return v.map(round);
  if (v && typeof v === 'object') return Object.fromEntries(Object.entries(v).map(([k, x]) => [k, round(x)]));
  return v;
}

/** The excerpt of a result the page shows: numbers to 6 significant digits, long lists cut. */
export function excerpt(result: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(result)) {
    if (OMIT.has(key)) continue;
    out[key] = Array.isArray(value) && key !== 'tests' && key !== 'warnings' && key !== 'coefficients' ? value.slice(0, MAX_ROWS) : value;
  }
  return round(out) as Record<string, unknown>;
}

/** JSON laid out for reading: a value that fits in 100 characters stays on one line. */
export function compactJson(v: unknown, indent = ''): string {
  const flat = JSON.stringify(v);
  if (flat.length + indent.length <= 100 || v === null || typeof v !== 'object') return flat.replace(/,(?=["{\[\d-])/g, ', ').replace(/":/g, '": ');
  const inner = `${indent}  `;
  if (Array.isArray(v)) return `[\n${v.map((x) => inner + compactJson(x, inner)).join(',\n')}\n${indent}]`;
  return `{\n${Object.entries(v).map(([k, x]) => `${inner}${JSON.stringify(k)}: ${compactJson(x, inner)}`).join(',\n')}\n${indent}}`;
}

/** The command line shown for an example. */
export function commandLine(ex: DocExample): string {
  return `npm run --silent rerun -- --plan ${ex.plan} --data ${ex.data}`;
}

/** Runs an example's command and returns the parsed result. */
export function runExample(ex: DocExample): Record<string, unknown> {
  const run = runCli(['--plan', ex.plan, '--data', ex.data]);
  if (run.code !== 0) throw new Error(`${commandLine(ex)} exited ${run.code}: ${run.stderr}`);
  return JSON.parse(run.stdout) as Record<string, unknown>;
}

/** Marker lines that delimit an example's generated block in the page. */
export function markers(name: string): { start: string; end: string } {
  return { start: `<!-- example:${name}:start -->`, end: `<!-- example:${name}:end -->` };
}

/** The generated block for one example. */
function block(ex: DocExample, result: Record<string, unknown>): string {
  const plan = compactJson(JSON.parse(readFileSync(join(ROOT, ex.plan), 'utf8')));
  return [
    `Plan (\`${ex.plan}\`):`,
    '',
    '```json',
    plan,
    '```',
    '',
    '```sh',
    commandLine(ex),
    '```',
    '',
    `Output (numbers to 6 significant digits; lists longer than ${MAX_ROWS} rows cut, except tests, coefficients and warnings; \`timings\` and \`qq\` left out):`,
    '',
    '```json',
    compactJson(excerpt(result)),
    '```',
  ].join('\n');
}

/** Rewrites every example block of the page from the command's current output. */
export function updateDocs(path = join(ROOT, 'docs/rerun-contract.md')): void {
  let text = readFileSync(path, 'utf8');
  for (const ex of DOC_EXAMPLES) {
    const { start, end } = markers(ex.name);
    const a = text.indexOf(start);
    const b = text.indexOf(end);
    if (a < 0 || b < a) throw new Error(`docs page lacks the markers for example ${ex.name}`);
    text = `${text.slice(0, a + start.length)}\n${block(ex, runExample(ex))}\n${text.slice(b)}`;
  }
  writeFileSync(path, text);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) updateDocs();
