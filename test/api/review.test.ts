/**
 * The review routes on a real MariaDB: reruns in a worker with progress over server-sent
 * events, stored with engine version, data hash and timings; reproduction; plan variants;
 * checklist findings and verdicts with optimistic locking; sanitized comments and internal
 * notes; revision requests and decisions; role and ownership checks.
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import type { IncomingMessage } from 'node:http';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { CRITERIA } from '../../shared/api/types';
import { ENGINE_VERSION } from '../../shared/stats/version';
import { Assignment, AuditLog, Comment, Dataset, Notification, Rerun, ReviewRequest } from '../../server/models/index';
import type { ApiClient } from './support/client';
import { useApiHarness } from './support/harness';
import { liveState, subscriberCount } from '../../server/services/rerun-live';
import { judgeAll, readEvents, startRerun, waitForRerun } from './support/review';

const fixture = (name: string) => fs.readFileSync(path.resolve('fixtures/demo', name));
const sha256 = (b: Buffer | string) => createHash('sha256').update(b).digest('hex');
const versionOf = async (id: string) => (await ReviewRequest.findByPk(id, { rejectOnEmpty: true })).version;

describe('review: reruns, checklist, comments, decisions', () => {
  const h = useApiHarness();
  let sub: ApiClient;
  let rev: ApiClient;
  let rev2: ApiClient;
  let head: ApiClient;
  let admin: ApiClient;
  /** HV-2026-004: the submitter's repeated-measures study, in review with reviewer. */
  let belonging: string;
  /** HV-2026-003: the submitter's factorial between study, filed; assigned to reviewer below. */
  let modality: string;

  beforeAll(async () => {
    [sub, rev, rev2, head, admin] = await Promise.all(['submitter', 'reviewer', 'reviewer2', 'head', 'admin'].map((k) => h.as(k)));
    belonging = await h.requestId('HV-2026-004');
    modality = await h.requestId('HV-2026-003');
  });

  describe('reruns', () => {
    let first: any;

    it('streams progress and stores the result with engine version, data hash and timings', async () => {
      first = await startRerun(rev, belonging);
      // The demo seed already ran this request "as filed", so this is its second rerun.
      expect(first).toMatchObject({ label: 'variant 2', status: 'queued', revisionNo: 1, engineVersion: ENGINE_VERSION });
      const stream = await readEvents(rev, first['id']);
      expect(stream.status).toBe(200);
      expect(stream.contentType).toMatch(/^text\/event-stream/);
      // The worker takes far longer to start than the stream to open, so the first event is live progress.
      expect(stream.events[0]!.event).toBe('progress');
      expect(stream.events.at(-1)).toEqual({ event: 'done', data: { status: 'done', progress: 1, stage: 'done' } });
      const fractions = stream.events.filter((e) => e.event === 'progress').map((e) => e.data['progress'] as number);
      expect(fractions.every((f, i) => f >= 0 && f <= 1 && (i === 0 || f >= fractions[i - 1]!))).toBe(true);

      const detail = await waitForRerun(rev, first['id']);
      expect(detail.status).toBe('done');
      expect(detail.engineVersion).toBe(ENGINE_VERSION);
      expect(detail.dataSha256).toBe(sha256(fixture('belonging-survey.csv')));
      expect(detail.result.engine).toBe(ENGINE_VERSION);
      expect(detail.result.design).toBe('anova');
      expect(detail.result.tests.map((t: { term: string }) => t.term)).toContain('wave');
      expect(detail.planSnapshot).toMatchObject({ design: 'anova', within: ['wave'], subject: 'student_id' });
      for (const k of ['queuedMs', 'parseMs', 'totalMs']) expect(detail.timings[k]).toBeGreaterThanOrEqual(0);
      expect(detail.timings.totalMs).toBeGreaterThanOrEqual(detail.timings.parseMs);
      expect(detail.progress).toBe(1);
      expect(detail.startedBy.email).toBe('reviewer@demo.test');
    });

    it('sends the final state at once to a late subscriber and ends', async () => {
      const late = await readEvents(rev, first['id']);
      expect(late.events).toEqual([{ event: 'done', data: { status: 'done', progress: 1, stage: 'done' } }]);
    });

    it('sends heartbeats and drops the subscriber when the client goes away', async () => {
      process.env['SSE_HEARTBEAT_MS'] = '20';
      try {
        const run = await startRerun(rev, belonging, { label: 'heartbeat check' });
        let text = '';
        let stillLive = false;
        await rev.agent.get(`/api/reruns/${run.id}/events`).buffer(false).parse((res, done) => {
          const stream = res as unknown as IncomingMessage;
          stream.setEncoding('utf8');
          stream.on('data', (chunk: string) => {
            text += chunk;
            if (text.includes(': heartbeat') && !stream.destroyed) {
              stillLive = liveState(run.id) !== null;
              stream.destroy();
              done(null, text);
            }
          });
          stream.on('end', () => done(null, text));
        }).catch(() => undefined);
        expect(text).toMatch(/^retry: 3000\n\nevent: progress\ndata: \{"status":"(queued|running)"/);
        expect(text).toContain(': heartbeat\n\n');
        // The rerun is still running; its only subscriber left.
        expect(stillLive).toBe(true);
        await new Promise((r) => setTimeout(r, 100));
        expect(subscriberCount(run.id)).toBe(0);
        expect((await waitForRerun(rev, run.id)).status).toBe('done');
      } finally {
        delete process.env['SSE_HEARTBEAT_MS'];
      }
    });

    it('reproduces a stored rerun exactly', async () => {
      const res = await rev.send('post', `/api/reruns/${first['id']}/reproduce`);
      expect(res.status, res.text).toBe(201);
      expect(res.body).toMatchObject({ originalId: first['id'], identical: true, differences: [] });
      expect(res.body.rerun).toMatchObject({ status: 'done', dataSha256: first['dataSha256'], label: expect.stringMatching(/^reproduction of/) });
      const copy = await waitForRerun(rev, res.body.rerun.id);
      const orig = await waitForRerun(rev, first['id']);
      expect(copy.planSnapshot).toEqual(orig.planSnapshot);
      const { timings: _a, ...a } = copy.result;
      const { timings: _b, ...b } = orig.result;
      expect(a).toEqual(b);
      const entry = await AuditLog.findOne({ where: { action: 'rerun.reproduced', entityId: first['id'] } });
      expect(entry?.details).toMatchObject({ identical: true });
    });

    it('reproduces the seeded rerun, and reports a stored result that no longer matches', async () => {
      const seeded = (await rev.get(`/api/requests/${belonging}/reruns`)).body.at(-1);
      expect(seeded.label).toBe('as filed');
      const same = await rev.send('post', `/api/reruns/${seeded.id}/reproduce`);
      expect(same.body).toMatchObject({ identical: true, differences: [] });
      // Tamper with the stored result: reproduction must notice.
      const row = await Rerun.findByPk(seeded.id, { rejectOnEmpty: true });
      await Rerun.update({ result: { ...row.result, n: 999 } }, { where: { id: seeded.id } });
      const changed = await rev.send('post', `/api/reruns/${seeded.id}/reproduce`);
      expect(changed.status).toBe(201);
      expect(changed.body).toMatchObject({ identical: false, differences: ['n'] });
      await Rerun.update({ result: row.result }, { where: { id: seeded.id } });
    });

    it('keeps plan variants, labelled, and moves an assigned request to in review at its first rerun', async () => {
      const reviewerId = await h.userId('reviewer');
      const assigned = await head.send('put', `/api/requests/${modality}/assignment`, { reviewerId, version: await versionOf(modality) });
      expect(assigned.status, assigned.text).toBe(200);
      expect((await ReviewRequest.findByPk(modality))!.state).toBe('assigned');

      const asFiled = await startRerun(rev, modality);
      expect(asFiled['label']).toBe('as filed');
      expect((await ReviewRequest.findByPk(modality))!.state).toBe('in-review');
      const gh = await startRerun(rev, modality, { label: 'with Games–Howell', planOverride: { comparisons: [{ factor: 'modality', method: 'games-howell' }] } });
      const unnamed = await startRerun(rev, modality, { planOverride: { ssType: 2 } });
      expect(unnamed['label']).toBe('variant 3');

      const ghDone = await waitForRerun(rev, gh['id']);
      expect(ghDone.status, ghDone.error).toBe('done');
      expect(ghDone.label).toBe('with Games–Howell');
      expect(ghDone.planSnapshot.comparisons).toEqual([{ factor: 'modality', method: 'games-howell' }]);
      expect(ghDone.planSnapshot.between).toEqual(['modality', 'term']);
      expect(new Set(ghDone.result.comparisons.map((c: { method: string }) => c.method))).toEqual(new Set(['games-howell']));
      const base = await waitForRerun(rev, asFiled['id']);
      expect(base.planSnapshot.comparisons).toEqual([{ factor: 'modality', method: 'holm' }]);
      expect((await waitForRerun(rev, unnamed['id'])).planSnapshot.ssType).toBe(2);

      const list = await rev.get(`/api/requests/${modality}/reruns`);
      expect(list.body.map((r: { label: string }) => r.label)).toEqual(['variant 3', 'with Games–Howell', 'as filed']);
    });

    it('refuses an invalid override with a 400 naming the field, and stores nothing', async () => {
      const before = await rev.get(`/api/requests/${modality}/reruns`);
      const bad = await rev.send('post', `/api/requests/${modality}/reruns`, { planOverride: { comparisons: [{ factor: 'modality', method: 'scheffe' }] } });
      expect(bad.status).toBe(400);
      expect(bad.body.error.fields).toHaveProperty(['planOverride.comparisons[0].method']);
      expect(bad.body.error.message).toMatch(/plan\.comparisons\[0\]\.method must be one of/);
      const unknownFactor = await rev.send('post', `/api/requests/${modality}/reruns`, { planOverride: { comparisons: [{ factor: 'campus', method: 'holm' }] } });
      expect(unknownFactor.status).toBe(400);
      expect(unknownFactor.body.error.message).toMatch(/'campus' is not one of the plan's factors/);
      const unknownField = await rev.send('post', `/api/requests/${modality}/reruns`, { planOverride: { colour: 'blue' } });
      expect(unknownField.status).toBe(400);
      expect(unknownField.body.error.message).toMatch(/plan\.colour is not a plan field/);
      expect((await rev.get(`/api/requests/${modality}/reruns`)).body).toHaveLength(before.body.length);
    });

    it('records an engine refusal as a failed rerun with the message, streamed as "failed"', async () => {
      const run = await startRerun(rev, modality, { label: 'wrong outcome', planOverride: { outcome: 'final_grade' } });
      const stream = await readEvents(rev, run['id']);
      const last = stream.events.at(-1)!;
      expect(last.event).toBe('failed');
      expect(last.data['error']).toMatch(/final_grade/);
      const detail = await waitForRerun(rev, run['id']);
      expect(detail).toMatchObject({ status: 'failed', result: null });
      expect(detail.error).toMatch(/final_grade/);
    });

    it('lets only the assigned reviewer and the head start reruns; the submitter sees completed ones only', async () => {
      expect((await sub.send('post', `/api/requests/${belonging}/reruns`, {})).status).toBe(403);
      expect((await admin.send('post', `/api/requests/${belonging}/reruns`, {})).status).toBe(403);
      expect((await rev2.send('post', `/api/requests/${belonging}/reruns`, {})).status).toBe(404);
      expect((await h.client().send('post', `/api/requests/${belonging}/reruns`, {})).status).toBe(401);
      const byHead = await startRerun(head, belonging, { label: 'head check' });
      await waitForRerun(head, byHead['id']);

      const mine = await sub.get(`/api/requests/${modality}/reruns`);
      expect(mine.status).toBe(200);
      expect(mine.body.length).toBeGreaterThan(0);
      expect(mine.body.every((r: { status: string }) => r.status === 'done')).toBe(true);
      const failed = (await rev.get(`/api/requests/${modality}/reruns`)).body.find((r: { status: string }) => r.status === 'failed');
      expect((await sub.get(`/api/reruns/${failed.id}`)).status).toBe(404);
      expect((await sub.get(`/api/reruns/${mine.body[0].id}`)).status).toBe(200);
      expect((await rev2.get(`/api/reruns/${mine.body[0].id}`)).status).toBe(404);
      expect((await rev2.get(`/api/requests/${modality}/reruns`)).status).toBe(404);
      expect((await rev.get('/api/reruns/not-a-uuid')).status).toBe(404);
      expect((await sub.send('post', `/api/reruns/${mine.body[0].id}/reproduce`)).status).toBe(403);
    });
  });

  describe('checklist', () => {
    it('lists all nine criteria in order with automatic findings from the latest rerun', async () => {
      const res = await rev.get(`/api/requests/${belonging}/checklist`);
      expect(res.status).toBe(200);
      expect(res.body.map((e: { criterion: string }) => e.criterion)).toEqual([...CRITERIA]);
      const latest = (await rev.get(`/api/requests/${belonging}/reruns`)).body.find((r: { status: string }) => r.status === 'done');
      for (const e of res.body) {
        expect(e.auto?.criterion).toBe(e.criterion);
        expect(e.rerunId).toBe(latest.id);
        expect(e).toMatchObject({ verdict: null, note: '', version: 0 });
      }
      const sph = res.body.find((e: { criterion: string }) => e.criterion === 'sphericity');
      expect(sph.auto.evidence.map((x: { label: string }) => x.label).join(' ')).toMatch(/Mauchly/i);
      const independence = res.body.find((e: { criterion: string }) => e.criterion === 'independence');
      expect(independence.auto.evidence).toContainEqual({ label: 'Sampling notes', value: expect.stringMatching(/panel of first-year students/) });
    });

    it('has no automatic findings before any rerun', async () => {
      const writing = await h.requestId('HV-2026-002');
      const res = await rev2.get(`/api/requests/${writing}/checklist`);
      expect(res.status).toBe(200);
      expect(res.body.every((e: { auto: unknown }) => e.auto === null)).toBe(true);
    });

    it('flags a subject in two between-groups and repeated ids in a between design', async () => {
      const rows = fixture('course-modality.csv').toString('utf8').trim().split('\n');
      const [, , second] = rows;
      // The same student once more, in another modality: the rows are no longer independent.
      const cells = second!.split(',');
      const other = cells[1] === 'online' ? 'hybrid' : 'online';
      const tampered = [...rows, [cells[0], other, cells[2], '71.0'].join(',')].join('\n');
      const bytes = Buffer.from(tampered);
      const r = await ReviewRequest.findByPk(modality, { rejectOnEmpty: true });
      await Dataset.create({
        requestId: modality, revisionNo: r.revisionNo, filename: 'course-modality-2.csv', mime: 'text/csv', bytes, sizeBytes: bytes.length,
        sha256: sha256(bytes), rowCount: rows.length, columns: [], uploadedById: null,
      });
      const run = await startRerun(rev, modality, { label: 'new data' });
      const done = await waitForRerun(rev, run['id']);
      expect(done.status, done.error).toBe('done');
      expect(done.dataSha256).toBe(sha256(bytes));
      const list = await rev.get(`/api/requests/${modality}/checklist`);
      const ind = list.body.find((e: { criterion: string }) => e.criterion === 'independence');
      expect(ind.rerunId).toBe(run['id']);
      expect(ind.auto.suggested).toBe('concern');
      const flags = ind.auto.evidence.filter((x: { label: string }) => x.label.startsWith('Flag')).map((x: { value: string }) => x.value);
      expect(flags).toEqual([
        expect.stringMatching(new RegExp(`${cells[0]} in .*${other}|${cells[0]} in ${other}`)),
        expect.stringMatching(new RegExp(`${cells[0]} ×2.*independent observation`)),
      ]);
    });

    it('saves a verdict with optimistic locking: a stale version is a 409 and changes nothing', async () => {
      const url = `/api/requests/${belonging}/checklist/sphericity`;
      const a = await rev.send('put', url, { verdict: 'met', note: 'GG applied.', version: 0 });
      expect(a.status, a.text).toBe(200);
      expect(a.body).toMatchObject({ criterion: 'sphericity', verdict: 'met', note: 'GG applied.', version: 1, reviewer: { email: 'reviewer@demo.test' } });
      const stale = await rev.send('put', url, { verdict: 'concern', note: 'from an old tab', version: 0 });
      expect(stale.status).toBe(409);
      const b = await rev.send('put', url, { verdict: 'concern', note: 'Epsilon is low.', version: 1 });
      expect(b.body).toMatchObject({ verdict: 'concern', version: 2 });
      const now = (await rev.get(`/api/requests/${belonging}/checklist`)).body.find((e: { criterion: string }) => e.criterion === 'sphericity');
      expect(now).toMatchObject({ verdict: 'concern', note: 'Epsilon is low.', version: 2 });
      const entry = await AuditLog.findOne({ where: { action: 'checklist.updated', entityId: belonging }, order: [['at', 'DESC']] });
      expect(entry?.details).toMatchObject({ criterion: 'sphericity', before: { verdict: 'met' }, after: { verdict: 'concern' } });
    });

    it('starts a never-saved entry at version 1, so a second tab still holding version 0 gets a 409', async () => {
      const url = `/api/requests/${modality}/checklist/outliers`;
      const before = (await rev.get(`/api/requests/${modality}/checklist`)).body.find((e: { criterion: string }) => e.criterion === 'outliers');
      expect(before).toMatchObject({ version: 0, verdict: null, updatedAt: null });
      const a = await rev.send('put', url, { verdict: 'met', note: 'No |z| > 3.', version: 0 });
      expect(a.body).toMatchObject({ verdict: 'met', version: 1 });
      expect((await rev.send('put', url, { verdict: 'not-met', note: 'other tab', version: 0 })).status).toBe(409);
      expect((await rev.get(`/api/requests/${modality}/checklist`)).body.find((e: { criterion: string }) => e.criterion === 'outliers')).toMatchObject({ verdict: 'met', version: 1 });
    });

    it('refuses two tabs racing on the same entry: exactly one wins', async () => {
      const url = `/api/requests/${belonging}/checklist/outliers`;
      const [x, y] = await Promise.all([
        rev.send('put', url, { verdict: 'met', note: 'tab one', version: 0 }),
        rev.send('put', url, { verdict: 'concern', note: 'tab two', version: 0 }),
      ]);
      expect([x.status, y.status].sort()).toEqual([200, 409]);
    });

    it('checks criterion, body, role and ownership', async () => {
      expect((await rev.send('put', `/api/requests/${belonging}/checklist/honesty`, { verdict: 'met', note: '', version: 0 })).body.error.fields).toHaveProperty('criterion');
      const badVerdict = await rev.send('put', `/api/requests/${belonging}/checklist/outliers`, { verdict: 'fine', note: '', version: 1 });
      expect(badVerdict.status).toBe(400);
      expect(badVerdict.body.error.fields).toHaveProperty('verdict');
      expect((await sub.send('put', `/api/requests/${belonging}/checklist/outliers`, { verdict: 'met', note: '', version: 1 })).status).toBe(403);
      expect((await head.send('put', `/api/requests/${belonging}/checklist/outliers`, { verdict: 'met', note: '', version: 1 })).status).toBe(403);
      expect((await rev2.send('put', `/api/requests/${belonging}/checklist/outliers`, { verdict: 'met', note: '', version: 1 })).status).toBe(404);
      expect((await sub.get(`/api/requests/${belonging}/checklist`)).status).toBe(403);
      expect((await head.get(`/api/requests/${belonging}/checklist`)).status).toBe(200);
    });
  });

  describe('comments', () => {
    const nasty = [
      '<p>Please check <strong>row 12</strong>.<script>alert(1)</script></p>',
      '<img src="x" onerror="alert(2)">',
      '<p onclick="alert(3)" style="color:red">styled</p>',
      '<a href="javascript:alert(4)">click</a>',
      '<a href="https://example.org/method" onmouseover="alert(5)">method note</a>',
      '<ul><li><em>one</em></li></ul><iframe src="https://evil.test"></iframe>',
    ].join('');

    it('sanitizes HTML on the server: scripts, handlers, styles and javascript: links are stripped', async () => {
      const res = await sub.send('post', `/api/requests/${belonging}/comments`, { body: nasty });
      expect(res.status, res.text).toBe(201);
      const html = res.body.bodyHtml as string;
      for (const bad of [/<script/i, /alert/, /onerror/i, /onclick/i, /onmouseover/i, /style=/i, /javascript:/i, /<img/i, /<iframe/i]) expect(html).not.toMatch(bad);
      expect(html).toContain('<strong>row 12</strong>');
      expect(html).toMatch(/<a href="https:\/\/example.org\/method" rel="noopener noreferrer nofollow">method note<\/a>/);
      expect(html).toContain('<ul><li><em>one</em></li></ul>');
      const stored = await Comment.findByPk(res.body.id as string, { rejectOnEmpty: true });
      expect(stored.bodyHtml).toBe(html);
      expect(res.body).toMatchObject({ internal: false, author: { email: 'submitter@demo.test' } });
    });

    it('refuses a comment with nothing left once markup is removed', async () => {
      const res = await sub.send('post', `/api/requests/${belonging}/comments`, { body: '<script>alert(1)</script>' });
      expect(res.status).toBe(400);
      expect(res.body.error.fields).toHaveProperty('body');
    });

    it('keeps internal notes from the submitter (not even counted) and notifies by role', async () => {
      const note = await rev.send('post', `/api/requests/${belonging}/comments`, { body: '<p>Between us: the wave 3 dip looks like a data entry issue.</p>', internal: true });
      expect(note.status, note.text).toBe(201);
      const open = await rev.send('post', `/api/requests/${belonging}/comments`, { body: '<p>Could you send the codebook?</p>' });
      expect(open.status).toBe(201);

      const forSubmitter = await sub.get(`/api/requests/${belonging}/comments`);
      expect(forSubmitter.body.some((c: { internal: boolean }) => c.internal)).toBe(false);
      expect(JSON.stringify(forSubmitter.body)).not.toMatch(/Between us/);
      const forReviewer = await rev.get(`/api/requests/${belonging}/comments`);
      const forHead = await head.get(`/api/requests/${belonging}/comments`);
      expect(forReviewer.body.filter((c: { internal: boolean }) => c.internal)).toHaveLength(1);
      expect(forHead.body).toHaveLength(forReviewer.body.length);
      expect(forSubmitter.body).toHaveLength(forReviewer.body.length - 1);

      const subId = await h.userId('submitter');
      const headId = await h.userId('head');
      const subNotes = await Notification.findAll({ where: { userId: subId, kind: 'comment.added', requestId: belonging } });
      expect(subNotes).toHaveLength(1);
      expect(await Notification.count({ where: { userId: headId, kind: 'comment.added', requestId: belonging } })).toBeGreaterThanOrEqual(1);
    });

    it('limits who may comment and who may write internal notes', async () => {
      expect((await sub.send('post', `/api/requests/${belonging}/comments`, { body: 'x', internal: true })).status).toBe(403);
      expect((await admin.send('post', `/api/requests/${belonging}/comments`, { body: 'x' })).status).toBe(403);
      expect((await rev2.send('post', `/api/requests/${belonging}/comments`, { body: 'x' })).status).toBe(404);
      expect((await rev2.get(`/api/requests/${belonging}/comments`)).status).toBe(404);
      expect((await head.send('post', `/api/requests/${belonging}/comments`, { body: '<p>Office note</p>', internal: true })).status).toBe(201);
      expect((await sub.send('post', `/api/requests/${belonging}/comments`, { body: 42 })).body.error.fields).toHaveProperty('body');
    });
  });

  describe('revision requests and decisions', () => {
    it('refuses a decision until every criterion has a verdict, naming the missing ones', async () => {
      const res = await rev.send('post', `/api/requests/${belonging}/decision`, { decision: 'endorse', conditions: [], rationale: 'Fine.', version: await versionOf(belonging) });
      expect(res.status).toBe(422);
      expect(res.body.error.message).toMatch(/missing: independence, variance-homogeneity/);
      expect(Object.keys(res.body.error.fields)).not.toContain('checklist.sphericity');
      expect(res.body.error.fields).toHaveProperty(['checklist.independence']);
    });

    it('refuses endorse with a not-met verdict, and endorse-with-conditions without a condition', async () => {
      await judgeAll(rev, belonging, (c) => (c === 'residual-normality' ? 'not-met' : 'met'));
      const v = await versionOf(belonging);
      const endorse = await rev.send('post', `/api/requests/${belonging}/decision`, { decision: 'endorse', conditions: [], rationale: 'Fine.', version: v });
      expect(endorse.status).toBe(422);
      expect(endorse.body.error.message).toMatch(/not met \(residual-normality\)/);
      const noCond = await rev.send('post', `/api/requests/${belonging}/decision`, { decision: 'endorse-with-conditions', conditions: [], rationale: 'Fine.', version: v });
      expect(noCond.status).toBe(400);
      expect(noCond.body.error.fields).toHaveProperty('conditions');
      expect((await ReviewRequest.findByPk(belonging))!.state).toBe('in-review');
    });

    it('returns a request for revision; the submitter reads the required changes', async () => {
      const v = await versionOf(belonging);
      expect((await sub.send('post', `/api/requests/${belonging}/revision-request`, { changes: ['x'], version: v })).status).toBe(403);
      expect((await rev.send('post', `/api/requests/${belonging}/revision-request`, { changes: [], version: v })).body.error.fields).toHaveProperty('changes');
      expect((await rev.send('post', `/api/requests/${belonging}/revision-request`, { changes: ['x'], version: v - 1 })).status).toBe(409);
      const changes = ['Report the Greenhouse–Geisser correction for the wave effect.', 'Describe how missing waves were handled.'];
      const res = await rev.send('post', `/api/requests/${belonging}/revision-request`, { changes, message: 'Nearly there.', version: v });
      expect(res.status, res.text).toBe(201);
      expect((await ReviewRequest.findByPk(belonging))!.state).toBe('revision-requested');
      const seen = await sub.get(`/api/requests/${belonging}/revision-request`);
      expect(seen.status).toBe(200);
      expect(seen.body).toMatchObject({ changes, message: 'Nearly there.', requestedBy: { email: 'reviewer@demo.test' }, revisionNo: 1 });
      const subId = await h.userId('submitter');
      expect(await Notification.count({ where: { userId: subId, kind: 'request.revision-requested', requestId: belonging } })).toBe(1);
      expect((await rev.send('post', `/api/requests/${belonging}/reruns`, {})).status).toBe(409);
      expect((await rev.send('put', `/api/requests/${belonging}/checklist/outliers`, { verdict: 'met', note: '', version: 9 })).status).toBe(409);
    });

    it('decides: decision stored with its rerun, request decided, assignment completed, submitter notified', async () => {
      expect((await sub.get(`/api/requests/${modality}/decision`)).status).toBe(404);
      await judgeAll(rev, modality, (c) => (c === 'independence' ? 'concern' : 'met'));
      const latest = (await rev.get(`/api/requests/${modality}/reruns`)).body.find((r: { status: string }) => r.status === 'done');
      const body = { decision: 'endorse-with-conditions', conditions: ['Remove the duplicated student before publishing.'], rationale: 'The analysis reproduces.', version: await versionOf(modality) };
      expect((await rev.send('post', `/api/requests/${modality}/decision`, { ...body, rerunId: '00000000-0000-4000-8000-000000000000' })).status).toBe(422);
      const res = await rev.send('post', `/api/requests/${modality}/decision`, body);
      expect(res.status, res.text).toBe(201);
      expect(res.body).toMatchObject({ decision: 'endorse-with-conditions', conditions: body.conditions, rerunId: latest.id, decidedBy: { email: 'reviewer@demo.test' } });
      const shown = await sub.get(`/api/requests/${modality}/decision`);
      expect(shown.body).toEqual(res.body);
      const r = await ReviewRequest.findByPk(modality, { rejectOnEmpty: true });
      expect(r.state).toBe('decided');
      expect(r.decidedAt).not.toBeNull();
      const a = await Assignment.findOne({ where: { requestId: modality, active: true, declined: false }, rejectOnEmpty: true });
      expect(a.completedAt).not.toBeNull();
      const subId = await h.userId('submitter');
      expect(await Notification.count({ where: { userId: subId, kind: 'request.decided', requestId: modality } })).toBe(1);
      expect((await rev.send('post', `/api/requests/${modality}/decision`, { ...body, version: r.version })).status).toBe(409);
    });
  });

  describe('API description', () => {
    it('serves the OpenAPI YAML and a readable page under the strict CSP', async () => {
      const yaml = await h.client().get('/api/docs/openapi.yaml');
      expect(yaml.status).toBe(200);
      expect(yaml.headers['content-type']).toMatch(/yaml/);
      expect(yaml.text).toBe(fs.readFileSync(path.resolve('docs/openapi.yaml'), 'utf8'));
      const page = await h.client().get('/api/docs');
      expect(page.status).toBe(200);
      expect(page.text).toContain('/api/reruns/{id}/events');
      expect(page.text).not.toMatch(/<script/i);
      expect(page.headers['content-security-policy']).toMatch(/default-src 'self'/);
    });
  });
});
