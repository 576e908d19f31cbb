/**
 * The worked examples in docs/rerun-contract.md must match what the command
 * prints today, so the page cannot drift from the engine. Numbers on the page
 * are rounded to 6 significant digits; each is compared with the fresh output
 * to a relative tolerance of 1e-5 (the rounding error of 6 digits is at most
 * 5e-6 relative).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DOC_EXAMPLES, commandLine, markers, runExample } from './doc-examples';
import { ROOT } from './run-cli';

const page = readFileSync(join(ROOT, 'docs/rerun-contract.md'), 'utf8');

/** Every mismatch between the page's excerpt and the actual output, as "path: shown vs actual". */
function differences(shown: unknown, actual: unknown, path: string, out: string[]): string[] {
  if (typeof shown === 'number') {
    if (typeof actual !== 'number' || Math.abs(actual - shown) > 1e-5 * Math.abs(actual) + 1e-300) out.push(`${path}: page ${shown} vs output ${String(actual)}`);
  } else if (Array.isArray(shown)) {
    if (!Array.isArray(actual)) out.push(`${path}: page has a list, output has ${typeof actual}`);
    else shown.forEach((x, i) => differences(x, actual[i], `${path}[${i}]`, out));
  } else if (shown && typeof shown === 'object') {
    if (!actual || typeof actual !== 'object') out.push(`${path}: page has an object, output has ${String(actual)}`);
    else for (const [k, v] of Object.entries(shown)) differences(v, (actual as Record<string, unknown>)[k], `${path}.${k}`, out);
  } else if (shown !== actual) {
    out.push(`${path}: page ${JSON.stringify(shown)} vs output ${JSON.stringify(actual)}`);
  }
  return out;
}

describe('docs/rerun-contract.md worked examples', () => {
  for (const ex of DOC_EXAMPLES) {
    it(`${ex.name}: the page shows the command's current output`, () => {
      const { start, end } = markers(ex.name);
      const section = page.slice(page.indexOf(start), page.indexOf(end));
      expect(section.length).toBeGreaterThan(start.length);
      expect(section).toContain(commandLine(ex));
      const blocks = [...section.matchAll(/```json\n([\s\S]*?)```/g)].map((m) => m[1]);
      expect(blocks).toHaveLength(2);
      expect(JSON.parse(blocks[0])).toEqual(JSON.parse(readFileSync(join(ROOT, ex.plan), 'utf8')));
      const shown = JSON.parse(blocks[1]) as Record<string, unknown>;
      expect(Object.keys(shown).length).toBeGreaterThan(5);
      expect(differences(shown, runExample(ex), 'result', [])).toEqual([]);
    });
  }
});
