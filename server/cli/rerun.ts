/**
 * The rerun command: `npm run --silent rerun -- --plan PLAN.json --data DATA.csv`.
 * Prints one JSON RerunResult on stdout and exits 0; invalid input prints one
 * line "rerun: <message>" on stderr and exits 2; any other failure exits 1.
 */
import { readFile } from 'node:fs/promises';
import { InputError } from '../../shared/stats/contract';
import { runPlan } from '../../shared/stats/rerun';
import { readTableFile } from '../tabular/read-table';

const USAGE = `usage: npm run --silent rerun -- --plan PLAN.json --data DATA.csv [--pretty]

Reruns an analysis plan on a data file and prints the result as one JSON document.
  --plan FILE   analysis plan (JSON); see docs/rerun-contract.md for its fields
  --data FILE   data in long format with a header row: .csv (comma, semicolon or
                tab delimited, UTF-8) or .xlsx (first worksheet)
  --pretty      indent the JSON output
  --help        show this help
Exit codes: 0 result printed, 2 invalid input (message on stderr), 1 other failure.`;

/** Command-line options after parsing. */
interface CliOptions {
  plan: string;
  data: string;
  pretty: boolean;
}

/** Parses argv; returns null when help was asked for. Throws InputError for bad usage. */
function parseArgs(argv: string[]): CliOptions | null {
  let plan: string | undefined;
  let data: string | undefined;
  let pretty = false;
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    const [flag, inline] = arg.startsWith('--') && arg.includes('=') ? [arg.slice(0, arg.indexOf('=')), arg.slice(arg.indexOf('=') + 1)] : [arg, undefined];
    const value = (): string => {
      const v = inline ?? argv[++i];
      if (v === undefined || v === '') throw new InputError(flag, `${flag} needs a file path`);
      return v;
    };
    if (flag === '--help' || flag === '-h') return null;
    else if (flag === '--plan') plan = value();
    else if (flag === '--data') data = value();
    else if (flag === '--pretty') pretty = true;
    else throw new InputError(arg, `unknown argument '${arg}' (try --help)`);
  }
  if (!plan) throw new InputError('--plan', 'missing --plan PLAN.json (try --help)');
  if (!data) throw new InputError('--data', 'missing --data DATA.csv (try --help)');
  return { plan, data, pretty };
}

/** Reads and parses the plan file; a missing file or invalid JSON is an InputError. */
async function readPlan(path: string): Promise<unknown> {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    throw new InputError('--plan', `plan file ${path} ${code === 'ENOENT' ? 'does not exist' : `cannot be read (${code ?? (err as Error).message})`}`);
  }
  try {
    return JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch (err) {
    throw new InputError('--plan', `plan file ${path} is not valid JSON: ${(err as Error).message}`);
  }
}

/** Runs the command and returns the exit code. */
async function main(argv: string[]): Promise<number> {
  try {
    const options = parseArgs(argv);
    if (!options) {
      process.stdout.write(`${USAGE}\n`);
      return 0;
    }
    const plan = await readPlan(options.plan);
    const readStart = performance.now();
    const table = await readTableFile(options.data);
    const parseMs = Math.round((performance.now() - readStart) * 10) / 10;
    const result = runPlan(plan, table);
    result.timings = { parseMs, computeMs: result.timings?.computeMs ?? 0 };
    process.stdout.write(`${JSON.stringify(result, null, options.pretty ? 2 : undefined)}\n`);
    return 0;
  } catch (err) {
    if (err instanceof InputError) {
      process.stderr.write(`rerun: ${err.message.replace(/\s*\n\s*/g, ' ')}\n`);
      return 2;
    }
    process.stderr.write(`rerun: internal error: ${err instanceof Error ? err.message : String(err)}\n`);
    return 1;
  }
}

main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  () => {
    process.exitCode = 1;
  },
);
