/**
 * Seeds the review work of the demo requests that are in review or decided: a completed
 * rerun of the stored plan on the stored data (the engine runs right here, synchronously:
 * seeding serves no requests), the checklist with the reviewer's verdicts and notes, and
 * for the decided request its signed letter, so the demo shows a letter to download and
 * verify. Idempotent: each part is added only when the request has none yet.
 */
import { QueryTypes } from 'sequelize';
import { CRITERIA } from '../../shared/api/types';
import { autoFindings } from '../../shared/review/checklist-findings';
import { runPlan } from '../../shared/stats/rerun';
import type { RerunResult } from '../../shared/stats/contract';
import type { OfficeKeys } from '../letters/index';
import { ChecklistEntry, Dataset, DecisionRow, Letter, Rerun, ReviewRequest, type User } from '../models/index';
import { enginePlanOf } from '../services/letter-compose';
import { decisionRerunId, issueLetterVersion, latestDecision } from '../services/letters';
import { readTableBytes } from '../tabular/index';
import { DEMO_REQUESTS, type DemoRequest } from './demo-requests';

/** What the review seeding added. */
export interface ReviewSeedReport { reruns: number; checklists: number; letters: number }

/** Inputs of {@link seedReviews}. */
export interface ReviewSeedOptions {
  people: Map<string, User>;
  now: Date;
  /** Office keys to sign the demo letter with (loaded lazily: only needed when a letter is missing). */
  keys: () => OfficeKeys;
  publicUrl: string;
}

const day = (now: Date, offset: number, hours = 0) => new Date(now.getTime() + offset * 86_400_000 + hours * 3_600_000);

async function seedRerun(r: ReviewRequest, d: DemoRequest, reviewer: User, at: Date): Promise<Rerun | null> {
  const dataset = await Dataset.scope('withBytes').findOne({ where: { requestId: r.id }, order: [['createdAt', 'DESC']] });
  const plan = enginePlanOf(r.plan, (r.reported as { term?: string; text: string }[] | null) ?? []);
  if (!dataset || !plan) return null;
  const started = performance.now();
  const table = await readTableBytes(dataset.bytes, dataset.filename);
  const parseMs = Math.round(performance.now() - started);
  const result = runPlan(plan, table);
  const totalMs = Math.round(performance.now() - started);
  return Rerun.create({
    requestId: r.id, datasetId: dataset.id, label: 'as filed', status: 'done', engineVersion: result.engine, planSnapshot: plan as unknown as Record<string, unknown>,
    dataSha256: dataset.sha256, timings: { queuedMs: 0, parseMs, totalMs }, result: result as unknown as Record<string, unknown>, error: null,
    startedById: reviewer.id, startedAt: at, finishedAt: new Date(at.getTime() + totalMs), createdAt: at, updatedAt: at,
  });
}

async function seedChecklist(r: ReviewRequest, d: DemoRequest, rerun: Rerun, reviewer: User, at: Date): Promise<void> {
  const findings = autoFindings(rerun.result as unknown as RerunResult, { samplingNotes: d.samplingNotes });
  for (const criterion of CRITERIA) {
    const given = d.review?.checklist?.find((c) => c.criterion === criterion);
    await ChecklistEntry.create({
      requestId: r.id, criterion, verdict: given?.verdict ?? null, note: given?.note ?? '',
      autoFinding: (findings.find((f) => f.criterion === criterion) ?? null) as unknown as Record<string, unknown> | null,
      rerunId: rerun.id, reviewerId: reviewer.id, createdAt: at, updatedAt: at,
    });
  }
}

/** Adds the missing review work of every demo request that has some. */
export async function seedReviews(o: ReviewSeedOptions): Promise<ReviewSeedReport> {
  const report: ReviewSeedReport = { reruns: 0, checklists: 0, letters: 0 };
  for (const d of DEMO_REQUESTS) {
    if (!d.review || !d.reviewer) continue;
    const r = await ReviewRequest.findOne({ where: { reference: d.reference } });
    const reviewer = o.people.get(d.reviewer);
    if (!r || !reviewer) continue;
    const ranAt = day(o.now, d.review.rerunDay);
    let rerun = await Rerun.findOne({ where: { requestId: r.id, status: 'done' }, order: [['finishedAt', 'DESC']] });
    if (!rerun) {
      rerun = await seedRerun(r, d, reviewer, ranAt);
      if (!rerun) continue;
      report.reruns++;
    }
    if (d.review.checklist && !(await ChecklistEntry.count({ where: { requestId: r.id } }))) {
      await seedChecklist(r, d, rerun, reviewer, day(ranAt, 1));
      report.checklists++;
    }
    if (!d.review.letter || r.state !== 'decided' || (await Letter.count({ where: { requestId: r.id } }))) continue;
    const decision = await latestDecision(r.id);
    if (!decision) continue;
    // decisions.rerunId comes from the review migration and is not on the core model; the review service writes it the same way.
    if (!(await decisionRerunId(decision.id))) {
      await DecisionRow.sequelize!.query('UPDATE decisions SET rerunId = ? WHERE id = ?', { replacements: [rerun.id, decision.id], type: QueryTypes.UPDATE });
    }
    const signedAt = day(decision.decidedAt, 0, 2);
    await issueLetterVersion({
      request: r, decision, signer: reviewer, signerRole: 'Methods reviewer', countersigner: null, previous: null,
      signatures: [{ role: 'reviewer', userId: reviewer.id, name: reviewer.name, email: reviewer.email, at: signedAt.toISOString(), confirmedBy: 'password' }],
      keys: o.keys(), env: { publicUrl: o.publicUrl, runDir: '' }, now: signedAt,
    });
    report.letters++;
  }
  return report;
}
