/**
 * Renders the letter the demo seed signs for its decided request (HV-2026-001, the advising
 * pilot) without a database: the same demo people, office settings, fixture data, engine
 * rerun, checklist notes and decision, composed by the same code as the server, signed with
 * throwaway keys. Writes OUTDIR/letter.pdf and OUTDIR/letter-page-<n>.png (pdftoppm).
 * Usage: npx tsx server/db/render-seeded-letter.ts [OUTDIR=docs/images] [dpi=80]
 */
import { createHash } from 'node:crypto';
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { CRITERIA } from '../../shared/api/types';
import { autoFindings } from '../../shared/review/checklist-findings';
import { runPlan } from '../../shared/stats/rerun';
import { generateSigningKeys, signLetter } from '../letters/index';
import { composeLetterInput, enginePlanOf, letterheadFrom, verifyUrlFor } from '../services/letter-compose';
import { readTableBytes } from '../tabular/index';
import { DEMO_PEOPLE } from './demo-people';
import { DEMO_REQUESTS } from './demo-requests';
import { DEMO_OFFICE_NAME, DEMO_OFFICE_SETTINGS } from './seed';

const [outDir = 'docs/images', dpi = '80'] = process.argv.slice(2);
// Fixed "today" and code so the committed pictures only change when the letter does.
const NOW = new Date('2026-11-30T09:00:00Z');
const CODE = '7M3P-FMM4-R68W';
const day = (offset: number, hours = 0) => new Date(NOW.getTime() + offset * 86_400_000 + hours * 3_600_000);

const d = DEMO_REQUESTS.find((x) => x.review?.letter && x.decision);
if (!d?.slug || !d.decision || !d.reviewer || d.filedDay === null) throw new Error('The demo data has no decided request with a letter.');
const person = (key: string) => {
  const p = DEMO_PEOPLE.find((x) => x.key === key);
  if (!p) throw new Error(`no demo person ${key}`);
  return { name: p.name, email: p.email };
};
const csvPath = path.join('fixtures/demo', `${d.slug}.csv`);
const bytes = fs.readFileSync(csvPath);
const sha = createHash('sha256').update(bytes).digest('hex');
const plan = enginePlanOf(JSON.parse(fs.readFileSync(path.join('fixtures/demo', `${d.slug}.plan.json`), 'utf8')), d.reported);
if (!plan) throw new Error(`fixtures/demo/${d.slug}.plan.json is not a plan`);
const table = await readTableBytes(bytes, path.basename(csvPath));
const result = runPlan(plan, table);
const findings = autoFindings(result, { samplingNotes: d.samplingNotes });

const input = composeLetterInput({
  office: { name: DEMO_OFFICE_NAME, settings: DEMO_OFFICE_SETTINGS },
  request: { id: 'demo', reference: d.reference, title: d.title, purpose: d.purpose, designKind: d.designKind, plan, filedAt: day(d.filedDay), createdAt: day(d.createdDay) },
  submitter: person(d.submitter),
  signer: { ...person(d.reviewer), role: 'Methods reviewer' },
  countersigner: null,
  dataset: { filename: path.basename(csvPath), sha256: sha, rows: table.columns[0]?.length ?? 0 },
  rerun: { id: 'demo-rerun', engineVersion: result.engine, dataSha256: sha, planSnapshot: plan, result },
  checklist: CRITERIA.map((criterion) => {
    const given = d.review?.checklist?.find((c) => c.criterion === criterion);
    return { criterion, verdict: given?.verdict ?? null, note: given?.note ?? '', autoFinding: findings.find((f) => f.criterion === criterion) ?? null };
  }),
  decision: { ...d.decision, decidedAt: day(d.decision.day) },
  verification: { code: CODE, url: verifyUrlFor('http://localhost:4280', CODE) },
  version: 1,
  supersedes: null,
  signedAt: day(d.decision.day, 2),
});
const lh = letterheadFrom(DEMO_OFFICE_NAME, DEMO_OFFICE_SETTINGS);
const signed = await signLetter(input, generateSigningKeys({ officeName: lh.officeName, unit: lh.unit || undefined }));
fs.mkdirSync(outDir, { recursive: true });
const pdfPath = path.join(outDir, 'letter.pdf');
fs.writeFileSync(pdfPath, signed.pdf);
const png = spawnSync('pdftoppm', ['-r', dpi, '-png', pdfPath, path.join(outDir, 'letter-page')], { stdio: 'inherit' });
if (png.error || png.status !== 0) {
  console.error('pdftoppm failed or is missing (apt-get install poppler-utils); the PDF is at', pdfPath);
  process.exitCode = 1;
} else {
  fs.rmSync(pdfPath);
  console.log(`wrote ${fs.readdirSync(outDir).filter((f) => f.startsWith('letter-page-')).map((f) => path.join(outDir, f)).join(', ')}`);
}
