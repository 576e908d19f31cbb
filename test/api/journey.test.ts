/**
 * The whole review journey through the API on a real MariaDB, for three designs (two
 * independent groups, a factorial between design, a mixed design), with the demo accounts:
 * filing with a malformed upload and an identifier block, assignment with a conflict-of-
 * interest refusal, reruns streamed over server-sent events, the checklist, a revision
 * round, concurrent checklist edits from two tabs, the decision, and the e-mails caught by
 * the fake SMTP server at each step.
 */
import fs from 'node:fs';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { CRITERIA } from '../../shared/api/types';
import type { PlanDraft } from '../../shared/api/workflow';
import { formatTest } from '../../shared/stats/apa/format';
import type { RerunResult, TestRow } from '../../shared/stats/contract';
import type { ApiClient } from './support/client';
import { emailOf, TEST_PASSWORD, useApiHarness } from './support/harness';
import { waitForMail } from './support/mail';
import { judgeAll, readEvents, startRerun, waitForRerun } from './support/review';

const fixture = (name: string) => fs.readFileSync(path.resolve('fixtures/demo', name));
const CONFIRM_REASON = 'Pseudonymous study codes issued by the office; needed to check independence.';

/** One study filed through the journey. */
interface Study {
  name: string;
  csv: string;
  plan: Partial<PlanDraft>;
  /** What the submitter first reports (deliberately not what the data give). */
  reported: { term: string; text: string };
  /** Terms the rerun must test. */
  terms: string[];
  decision: 'endorse' | 'endorse-with-conditions';
}

const STUDIES: Study[] = [
  {
    name: 'two independent groups', csv: 'advising-pilot.csv',
    plan: { designKind: 'two-independent', outcome: 'credits_completed', between: [{ column: 'first_generation', levels: ['no', 'yes'] }], subject: 'student_id' },
    reported: { term: 'first_generation', text: 't(88) = 2.50, p = .014' }, terms: ['first_generation'], decision: 'endorse',
  },
  {
    name: 'a factorial between design', csv: 'course-modality.csv',
    plan: {
      designKind: 'between-anova', outcome: 'final_score', between: [{ column: 'modality', levels: [] }, { column: 'term', levels: [] }], subject: 'student_id',
      comparisons: [{ factor: 'modality', method: 'holm' }], submitterCorrection: 'holm',
    },
    reported: { term: 'modality', text: 'F(2, 114) = 3.30, p = .040' }, terms: ['modality', 'term', 'modality:term'], decision: 'endorse-with-conditions',
  },
  {
    name: 'a mixed design', csv: 'peer-tutoring.csv',
    plan: {
      designKind: 'mixed', outcome: 'score', between: [{ column: 'group', levels: [] }], within: [{ column: 'midterm', levels: ['1', '2', '3'] }], subject: 'student_id',
      comparisons: [{ factor: 'midterm', method: 'holm' }], submitterCorrection: 'holm',
    },
    reported: { term: 'group:midterm', text: 'F(2, 98) = 5.10, p = .008' }, terms: ['group', 'midterm', 'group:midterm'], decision: 'endorse',
  },
];

const draft = (p: Partial<PlanDraft>): PlanDraft => ({
  designKind: null, outcome: null, between: [], within: [], subject: null, predictors: [], alpha: 0.05, comparisons: [], submitterCorrection: null, ...p,
});

/** Posts a file as the browser's form would (multipart field "file", CSRF header). */
async function upload(c: ApiClient, id: string, bytes: Buffer, name: string) {
  if (!c.token) await c.get('/api/auth/csrf');
  return c.capture(await c.agent.post(`/api/requests/${id}/datasets`).set('X-XSRF-TOKEN', c.token!).attach('file', bytes, name));
}

async function version(c: ApiClient, id: string): Promise<number> {
  const res = await c.get(`/api/requests/${id}`);
  expect(res.status, res.text).toBe(200);
  return res.body.version as number;
}

/** The statistic and p of the rerun's row for a term, written as a submitter would report it. */
function corrected(result: RerunResult, term: string): string {
  const row = result.tests.find((t: TestRow) => t.term === term && (t.variant === undefined || t.variant === 'student'))!;
  return formatTest(row).split(', ').slice(0, 2).join(', ');
}

describe('the review journey', () => {
  const h = useApiHarness();
  let sub: ApiClient;
  let rev: ApiClient;
  let revOtherTab: ApiClient;
  let head: ApiClient;
  let conflicted: string;

  beforeAll(async () => {
    [sub, rev, revOtherTab, head] = await Promise.all(['submitter', 'reviewer', 'reviewer', 'head'].map((k) => h.as(k)));
    // A reviewer from the submitter's own department, added by the administrator: never assignable to her requests.
    const admin = await h.as('admin');
    const ssa = (await admin.get('/api/departments')).body.find((d: { code: string }) => d.code === 'SSA');
    const added = await admin.send('post', '/api/admin/users', { email: 'noor.halvorsen@demo.test', name: 'Noor Halvorsen', password: TEST_PASSWORD, roles: ['reviewer'], departmentId: ssa.id });
    expect(added.status, added.text).toBe(201);
    conflicted = added.body.id;
  });

  for (const study of STUDIES) {
    it(`walks ${study.name} from filing to decision, with a revision round`, { timeout: 240_000 }, async () => {
      // ── filing ──
      const created = await sub.send('post', '/api/requests', {
        title: `Journey: ${study.name}`, purpose: 'Check the analysis before the results go to the leadership team.',
        decisionInformed: 'Whether the programme continues next year.', audience: 'Student Success leadership team',
        samplingNotes: 'Every student of the cohort appears once per occasion; records come from the registry.',
      });
      expect(created.status, created.text).toBe(201);
      const id = created.body.id as string;
      const reference = created.body.reference as string;
      const patched = await sub.send('patch', `/api/requests/${id}`, { plan: draft(study.plan), reported: [study.reported], version: created.body.version });
      expect(patched.status, patched.text).toBe(200);

      const ragged = await upload(sub, id, Buffer.from('student_id,group,score\nS1,a,3\nS2,b\n'), 'ragged.csv');
      expect(ragged.status).toBe(422);
      expect(ragged.body.error.message).toMatch(/Row 3 \(line 3 of the file\) has 2 fields but the header has 3/);
      expect((await sub.get(`/api/requests/${id}/datasets`)).body).toEqual([]);

      const bytes = fixture(study.csv);
      const up = await upload(sub, id, bytes, study.csv);
      expect(up.status, up.text).toBe(201);
      expect(up.body).toMatchObject({ blocked: true, identifierFindings: [expect.objectContaining({ column: 'student_id' })] });
      const blocked = await sub.send('post', `/api/requests/${id}/submit`, { version: await version(sub, id) });
      expect(blocked.status).toBe(422);
      expect(blocked.body.error.fields['dataset']).toMatch(/direct identifiers/);
      expect((await sub.get(`/api/requests/${id}`)).body.state).toBe('draft');
      const confirmed = await sub.send('post', `/api/requests/${id}/datasets/${up.body.id}/identifiers`, { confirmations: [{ column: 'student_id', reason: CONFIRM_REASON }] });
      expect(confirmed.body.blocked).toBe(false);
      const filed = await sub.send('post', `/api/requests/${id}/submit`, { version: await version(sub, id) });
      expect(filed.status, filed.text).toBe(200);
      expect(filed.body.state).toBe('filed');
      await waitForMail((m) => m.to.includes(emailOf('head')) && m.subject === `New request to assign: ${reference}`);

      // ── intake ──
      const candidates = await head.get(`/api/requests/${id}/assignment/candidates`);
      expect(candidates.body.find((c: { reviewer: { id: string } }) => c.reviewer.id === conflicted).conflict).toMatch(/submitter's department/);
      const refused = await head.send('put', `/api/requests/${id}/assignment`, { reviewerId: conflicted, version: await version(head, id) });
      expect(refused.status).toBe(409);
      expect(refused.body.error.code).toBe('conflict-of-interest');
      const assigned = await head.send('put', `/api/requests/${id}/assignment`, { reviewerId: await h.userId('reviewer'), version: await version(head, id) });
      expect(assigned.status, assigned.text).toBe(200);
      expect(assigned.body.state).toBe('assigned');
      await waitForMail((m) => m.to.includes(emailOf('reviewer')) && m.subject === `Assigned to you: ${reference}`);

      // ── first review round ──
      const run1 = await startRerun(rev, id);
      expect(run1).toMatchObject({ label: 'as filed', revisionNo: 1 });
      const stream = await readEvents(rev, run1.id);
      expect(stream.events.at(-1)!.event).toBe('done');
      const done1 = await waitForRerun(rev, run1.id);
      expect(done1.dataSha256).toBe(up.body.sha256);
      for (const term of study.terms) expect(done1.result.tests.map((t: TestRow) => t.term)).toContain(term);
      expect((await rev.get(`/api/requests/${id}`)).body.state).toBe('in-review');
      expect(done1.result.reconciliation[0].verdict).not.toMatch(/^(consistent|rounding)$/);

      const checklist = await rev.get(`/api/requests/${id}/checklist`);
      expect(checklist.body.map((e: { criterion: string; auto: unknown; rerunId: string }) => [e.criterion, e.auto !== null, e.rerunId])).toEqual(CRITERIA.map((c) => [c, true, run1.id]));
      await judgeAll(rev, id, (c) => (c === 'reported-agreement' ? 'not-met' : 'met'));
      const changes = [`Report the statistic for ${study.reported.term} as the data give it.`];
      const revision = await rev.send('post', `/api/requests/${id}/revision-request`, { changes, message: 'Everything else reproduces.', version: await version(rev, id) });
      expect(revision.status, revision.text).toBe(201);
      const asked = await waitForMail((m) => m.to.includes(emailOf('submitter')) && m.subject === `Changes requested: ${reference}`);
      expect(asked.text).toContain(changes[0]);

      // ── the submitter revises ──
      const required = await sub.get(`/api/requests/${id}/revision-request`);
      expect(required.body).toMatchObject({ changes, requestedBy: { email: emailOf('reviewer') } });
      const fixedText = corrected(done1.result, study.reported.term);
      const revised = await sub.send('patch', `/api/requests/${id}`, { reported: [{ term: study.reported.term, text: fixedText }], version: await version(sub, id) });
      expect(revised.status, revised.text).toBe(200);
      const resubmitted = await sub.send('post', `/api/requests/${id}/submit`, { version: await version(sub, id), note: 'Reported statistic corrected.' });
      expect(resubmitted.status, resubmitted.text).toBe(200);
      expect(resubmitted.body.state).toBe('in-review');
      await waitForMail((m) => m.to.includes(emailOf('reviewer')) && m.subject === `Revision submitted: ${reference}`);

      // ── second round ──
      const run2 = await startRerun(rev, id);
      expect(run2).toMatchObject({ label: 'as filed', revisionNo: 2 });
      const done2 = await waitForRerun(rev, run2.id);
      expect(done2.status, done2.error).toBe('done');
      expect(done2.planSnapshot.reported).toEqual([{ term: study.reported.term, text: fixedText }]);
      expect(done2.result.reconciliation[0].verdict).toMatch(/^(consistent|rounding)$/);
      const { timings: _t2, reconciliation: _r2, ...same2 } = done2.result;
      const { timings: _t1, reconciliation: _r1, ...same1 } = done1.result;
      expect(same2).toEqual(same1);

      // Two tabs of the reviewer read the same entry; the second save is refused and loses nothing.
      const [tabA, tabB] = await Promise.all([rev.get(`/api/requests/${id}/checklist`), revOtherTab.get(`/api/requests/${id}/checklist`)]);
      const entryA = tabA.body.find((e: { criterion: string }) => e.criterion === 'reported-agreement');
      const entryB = tabB.body.find((e: { criterion: string }) => e.criterion === 'reported-agreement');
      expect(entryA.rerunId).toBe(run2.id);
      expect(entryA.version).toBe(entryB.version);
      const first = await rev.send('put', `/api/requests/${id}/checklist/reported-agreement`, { verdict: 'met', note: 'Corrected in revision 2.', version: entryA.version });
      expect(first.status, first.text).toBe(200);
      const second = await revOtherTab.send('put', `/api/requests/${id}/checklist/reported-agreement`, { verdict: 'concern', note: 'old tab', version: entryB.version });
      expect(second.status).toBe(409);
      expect((await rev.get(`/api/requests/${id}/checklist`)).body.find((e: { criterion: string }) => e.criterion === 'reported-agreement')).toMatchObject({ verdict: 'met', note: 'Corrected in revision 2.' });

      const conditions = study.decision === 'endorse-with-conditions' ? ['Report the Holm-adjusted comparisons of modality with their intervals.'] : [];
      const decided = await rev.send('post', `/api/requests/${id}/decision`, { decision: study.decision, conditions, rationale: 'The analysis reproduces from the stored data.', version: await version(rev, id) });
      expect(decided.status, decided.text).toBe(201);
      expect(decided.body).toMatchObject({ decision: study.decision, conditions, rerunId: run2.id });
      await waitForMail((m) => m.to.includes(emailOf('submitter')) && m.subject === `Review finished: ${reference}`);

      const outcome = await sub.get(`/api/requests/${id}`);
      expect(outcome.body.state).toBe('decided');
      expect((await sub.get(`/api/requests/${id}/decision`)).body).toEqual(decided.body);
      const versions = (await sub.get(`/api/requests/${id}/versions`)).body;
      expect(versions.map((v: { revisionNo: number; rerunIds: string[] }) => [v.revisionNo, v.rerunIds])).toEqual([[1, [run1.id]], [2, [run2.id]]]);
      const seen = (await sub.get(`/api/requests/${id}/reruns`)).body.map((r: { id: string }) => r.id);
      expect(seen).toEqual([run2.id, run1.id]);
    });
  }
});
