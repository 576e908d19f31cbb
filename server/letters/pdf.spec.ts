/**
 * Layout checks on unsigned renders: long content flows over pages without losing text,
 * every page carries the footer with the code and its page number, and the fixed texts
 * (scope caution, decision) are present. Text is read back with poppler's pdftotext.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { CRITERIA } from '../../shared/api/types';
import { SCOPE_CAUTION, renderLetterPdf } from './pdf';
import { advisingLetter } from './sample-letters';

const hasPdftotext = spawnSync('sh', ['-c', 'command -v pdftotext']).status === 0;
const dir = mkdtempSync(join(tmpdir(), 'assayer-letter-layout-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function pagesOf(pdf: Buffer): string[] {
  const file = join(dir, `l-${Math.random().toString(36).slice(2)}.pdf`);
  writeFileSync(file, pdf);
  return execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' }).split('\f').filter((p) => p.trim().length > 0);
}

const words = (n: number, tag: string) => Array.from({ length: n }, (_, i) => (i === n - 1 ? tag : 'the reviewer asks for clearer reporting')).join(' ');

describe.skipIf(!hasPdftotext)('letter layout', () => {
  it('puts the decision first, the caution and the code on the letter, and the footer on every page', async () => {
    const input = advisingLetter('7KQ2-M9XD-4TBH', 'https://assayer.harrowvale.test/verify/7KQ2-M9XD-4TBH');
    const pages = pagesOf(await renderLetterPdf(input));
    const all = pages.join('\n').replace(/\s+/g, ' ');
    expect(all.indexOf('Endorsed with conditions')).toBeLessThan(all.indexOf('The analysis plan'));
    expect(all).toContain(SCOPE_CAUTION);
    // The main test as the engine computed it on the demo data, in reporting style.
    const t = input.rerun.result.tests.find((row) => row.term === 'advising_format' && !row.variant)!;
    expect(all).toContain(`F(${t.df1}, ${t.df2}) = ${t.value.toFixed(2)}`);
    pages.forEach((p, i) => {
      expect(p).toContain('Verification code 7KQ2-M9XD-4TBH');
      expect(p).toContain(`Page ${i + 1} of ${pages.length}`);
    });
  }, 30_000);

  it('flows long conditions, notes and comparison tables over several pages without losing text', async () => {
    const input = advisingLetter('3FZR-8W1N-QC5M', 'https://assayer.harrowvale.test/verify/3FZR-8W1N-QC5M');
    input.conditions = Array.from({ length: 14 }, (_, i) => words(12, `COND${String(i).padStart(2, '0')}`));
    input.checklist = CRITERIA.map((criterion, i) => ({ criterion, verdict: 'concern' as const, reviewerNote: words(14, `NOTE${i}`), automaticFinding: `FIND${i}` }));
    const base = input.rerun.result.comparisons![0];
    input.rerun.result = { ...input.rerun.result, comparisons: Array.from({ length: 36 }, (_, i) => ({ ...base, a: `PAIR${String(i).padStart(2, '0')}`, b: 'Standard' })) };
    const pages = pagesOf(await renderLetterPdf(input));
    expect(pages.length).toBeGreaterThanOrEqual(4);
    const all = pages.join('\n');
    for (let i = 0; i < 14; i++) expect(all).toContain(`COND${String(i).padStart(2, '0')}`);
    for (let i = 0; i < CRITERIA.length; i++) {
      expect(all).toContain(`NOTE${i}`);
      expect(all).toContain(`FIND${i}`);
    }
    for (let i = 0; i < 36; i++) expect(all).toContain(`PAIR${String(i).padStart(2, '0')}`);
    // A table that continues on a new page repeats its header there.
    const continued = pages.filter((p) => /PAIR\d\d/.test(p));
    if (continued.length > 1) for (const p of continued) expect(p).toMatch(/Pair\s+Difference/);
    pages.forEach((p, i) => expect(p).toContain(`Page ${i + 1} of ${pages.length}`));
  }, 30_000);
});
