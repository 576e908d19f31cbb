/**
 * Renders the demo peer-tutoring letter (real rerun of fixtures/demo/peer-tutoring.csv,
 * signed with throwaway keys) to OUTDIR/demo-letter.pdf and, when poppler's pdftoppm is
 * installed, to OUTDIR/demo-letter-<page>.png for the README.
 * Usage: npx tsx server/letters/render-demo-letter.ts OUTDIR [dpi]
 */
import { createHash } from 'node:crypto';
import { spawnSync } from 'node:child_process';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { rerunFromText } from '../../shared/stats/rerun';
import { generateSigningKeys } from './keys';
import { tutoringLetter } from './sample-letters';
import { signLetter } from './sign';

const [outDir, dpi = '80'] = process.argv.slice(2);
if (!outDir) {
  console.error('Usage: npx tsx server/letters/render-demo-letter.ts OUTDIR [dpi]');
  process.exit(2);
}
mkdirSync(outDir, { recursive: true });
const csv = readFileSync('fixtures/demo/peer-tutoring.csv');
const plan = JSON.parse(readFileSync('fixtures/demo/peer-tutoring.plan.json', 'utf8'));
const result = rerunFromText(plan, csv.toString('utf8'));
const sha = createHash('sha256').update(csv).digest('hex');
const code = '3FZR-8W1N-QC5M';
const input = tutoringLetter(code, `https://assayer.harrowvale.test/verify/${code}`, result);
input.dataset = { ...input.dataset, sha256: sha };
input.rerun = { ...input.rerun, dataHash: sha };
const keys = generateSigningKeys({ officeName: input.letterhead.officeName, unit: input.letterhead.unit });
const signed = await signLetter(input, keys);
const pdfPath = join(outDir, 'demo-letter.pdf');
writeFileSync(pdfPath, signed.pdf);
console.log(`wrote ${pdfPath}`);
const png = spawnSync('pdftoppm', ['-r', dpi, '-png', pdfPath, join(outDir, 'demo-letter')], { stdio: 'inherit' });
if (png.error) console.log('pdftoppm not found: PDF only (apt-get install poppler-utils for PNG pages).');
else console.log(`wrote ${join(outDir, 'demo-letter-*.png')}`);
