/**
 * Filing through the API on a real MariaDB: uploads (CSV, XLSX, malformed files refused
 * with nothing stored), previews and downloads, identifier blocks, wide → long reshaping,
 * submit with per-field problems and an engine dry run, revisions, withdrawal, access
 * rules and optimistic locking. Data come from the demo studies in fixtures/demo/.
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import ExcelJS from 'exceljs';
import { QueryTypes } from 'sequelize';
import { beforeAll, describe, expect, it } from 'vitest';
import { Dataset, Notification, RequestVersion, ReviewRequest } from '../../server/models/index';
import { revisionRequests } from '../../server/models/revision-request';
import { ApiClient } from './support/client';
import { emailOf, TEST_PASSWORD, useApiHarness } from './support/harness';
import { waitForMail } from './support/mail';

const fixture = (name: string) => fs.readFileSync(path.resolve('fixtures/demo', name));
const lines = (buf: Buffer) => buf.toString('utf8').trim().split(/\r?\n/);
const CONFIRM_REASON = 'Pseudonymous study codes issued by the office; needed to pair repeated rows.';

/** Posts a file as the browser's form would (multipart field "file", CSRF header). */
async function upload(c: ApiClient, id: string, bytes: Buffer, name: string) {
  if (!c.token) await c.get('/api/auth/csrf');
  return c.capture(await c.agent.post(`/api/requests/${id}/datasets`).set('X-XSRF-TOKEN', c.token!).attach('file', bytes, name));
}

const PURPOSE = {
  purpose: 'Compare outcomes between the groups of the study for the office.',
  decisionInformed: 'Whether the programme continues next year.',
  audience: 'Student Success leadership team',
  samplingNotes: 'Every student of the cohort; one row per student and occasion, collected by the registry.',
};

async function newDraft(c: ApiClient, title: string, extra: Record<string, unknown> = {}): Promise<{ id: string; version: number }> {
  const res = await c.send('post', '/api/requests', { title, ...PURPOSE, ...extra });
  expect(res.status, res.text).toBe(201);
  return { id: res.body.id as string, version: res.body.version as number };
}

async function patch(c: ApiClient, id: string, fields: Record<string, unknown>) {
  const version = (await c.get(`/api/requests/${id}`)).body.version as number;
  const res = await c.send('patch', `/api/requests/${id}`, { ...fields, version });
  expect(res.status, res.text).toBe(200);
  return res.body as { version: number; state: string };
}

async function confirmFlagged(c: ApiClient, id: string, preview: { id: string; identifierFindings: { column: string }[] }) {
  const res = await c.send('post', `/api/requests/${id}/datasets/${preview.id}/identifiers`, {
    confirmations: preview.identifierFindings.map((f) => ({ column: f.column, reason: CONFIRM_REASON })),
  });
  expect(res.status, res.text).toBe(200);
  return res.body as { blocked: boolean };
}

const plan = (p: Record<string, unknown>) => ({ between: [], within: [], subject: null, predictors: [], alpha: 0.05, comparisons: [], submitterCorrection: null, ...p });
const versionOf = async (id: string) => (await ReviewRequest.findByPk(id, { rejectOnEmpty: true })).version;

describe('filing: uploads, submit, revisions', () => {
  const h = useApiHarness();
  let sub: ApiClient;

  beforeAll(async () => {
    sub = await h.as('submitter');
  });

  it('stores a CSV upload with its hash and profiles, and previews and downloads it', async () => {
    const { id } = await newDraft(sub, 'Course modality, again');
    const bytes = fixture('course-modality.csv');
    const res = await upload(sub, id, bytes, 'course-modality.csv');
    expect(res.status, res.text).toBe(201);
    const p = res.body;
    const rows = lines(bytes).slice(1).map((l) => l.split(','));
    expect(p.format).toBe('csv');
    expect(p.sha256).toBe(createHash('sha256').update(bytes).digest('hex'));
    expect(p.sizeBytes).toBe(bytes.length);
    expect(p.rows).toBe(rows.length);
    expect(p.previewRows).toHaveLength(20);
    expect(p.previewRows[0]).toEqual(rows[0]);
    const byName = Object.fromEntries(p.columns.map((c: { name: string }) => [c.name, c]));
    const scores = rows.map((r) => Number(r[3]));
    expect(byName['final_score']).toMatchObject({ kind: 'numeric', missing: 0, min: Math.min(...scores), max: Math.max(...scores) });
    expect(byName['modality']).toMatchObject({ kind: 'categorical', distinct: new Set(rows.map((r) => r[1])).size });
    expect(byName['student_id'].kind).toBe('identifier-like');
    // The student code column is flagged by its name until the submitter confirms it.
    expect(p.identifierFindings.map((f: { column: string }) => f.column)).toEqual(['student_id']);
    expect(p.blocked).toBe(true);

    const list = await sub.get(`/api/requests/${id}/datasets`);
    expect(list.status).toBe(200);
    expect(list.body).toHaveLength(1);
    expect(list.body[0]).toMatchObject({ id: p.id, rows: rows.length, previewRows: [] });
    const one = await sub.get(`/api/requests/${id}/datasets/${p.id}`);
    expect(one.body.previewRows).toEqual(p.previewRows);
    const file = await sub.agent.get(`/api/requests/${id}/datasets/${p.id}/file`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(file.status).toBe(200);
    expect(Buffer.compare(file.body as Buffer, bytes)).toBe(0);
    expect(String(file.headers['content-disposition'])).toContain('course-modality.csv');
    const detail = await sub.get(`/api/requests/${id}`);
    expect(detail.body.datasets.map((d: { id: string }) => d.id)).toEqual([p.id]);
    expect((await sub.get(`/api/requests/${id}/datasets/00000000-0000-4000-8000-000000000000`)).status).toBe(404);
  });

  it('reads an .xlsx workbook by its content, whatever its name', async () => {
    const { id } = await newDraft(sub, 'Writing lab workbook');
    const src = lines(fixture('writing-lab.csv')).map((l) => l.split(','));
    const wb = new ExcelJS.Workbook();
    const ws = wb.addWorksheet('essays');
    ws.addRow(src[0]);
    for (const r of src.slice(1, 11)) ws.addRow([r[0], r[1], Number(r[2])]);
    const bytes = Buffer.from(await wb.xlsx.writeBuffer());
    const res = await upload(sub, id, bytes, 'essays.xlsx');
    expect(res.status, res.text).toBe(201);
    expect(res.body).toMatchObject({ format: 'xlsx', rows: 10 });
    const score = res.body.columns.find((c: { name: string }) => c.name === 'score');
    const values = src.slice(1, 11).map((r) => Number(r[2]));
    expect(score).toMatchObject({ kind: 'numeric', min: Math.min(...values), max: Math.max(...values) });
    expect(res.body.previewRows[0]).toEqual([src[1][0], src[1][1], String(Number(src[1][2]))]);
    const renamed = await upload(sub, id, bytes, 'essays.csv');
    expect(renamed.status).toBe(201);
    expect(renamed.body.format).toBe('xlsx');
  });

  it('refuses malformed uploads with a specific status and message, storing nothing', async () => {
    const { id } = await newDraft(sub, 'Malformed uploads');
    const png = Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d]), Buffer.from('IHDR'), Buffer.alloc(40, 7)]);
    const pdf = Buffer.from('%PDF-1.7\n1 0 obj << /Type /Catalog >> endobj\n%\xe2\xe3\xcf\xd3\n', 'latin1');
    const xls = Buffer.concat([Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1]), Buffer.alloc(504)]);
    const cp1252 = Buffer.from('student,score\nS1,caf\xe9\n', 'latin1');
    const exe = Buffer.concat([Buffer.from('MZ'), Buffer.from([0x90, 0, 3, 0, 0, 0, 4, 0]), Buffer.alloc(50)]);
    const cases: { name: string; bytes: Buffer; status: number; message: RegExp }[] = [
      { name: 'chart.csv', bytes: png, status: 415, message: /looks like a PNG image/ },
      { name: 'report.pdf', bytes: pdf, status: 415, message: /looks like a PDF document/ },
      { name: 'old.xls', bytes: xls, status: 415, message: /old binary Office file/ },
      { name: 'tool.csv', bytes: exe, status: 415, message: /looks like a Windows program/ },
      { name: 'latin.csv', bytes: cp1252, status: 415, message: /encoding other than UTF-8/ },
      { name: 'empty.csv', bytes: Buffer.alloc(0), status: 422, message: /The file is empty/ },
      { name: 'header.csv', bytes: Buffer.from('student_code,score\n'), status: 422, message: /header row but no data rows/ },
      { name: 'ragged.csv', bytes: Buffer.from('code,group,score\nA1,x,3\nA2,y\nA3,x,4\n'), status: 422, message: /Row 3 \(line 3 of the file\) has 2 fields but the header has 3/ },
      { name: 'dup.csv', bytes: Buffer.from('code,score,Score\nA1,3,4\n'), status: 422, message: /Columns 2 and 3 are both named "Score"/ },
      { name: 'blank.csv', bytes: Buffer.from('code,,score\nA1,3,4\n'), status: 422, message: /Column 2 has no name in the header row/ },
    ];
    const before = await Dataset.count();
    for (const c of cases) {
      const res = await upload(sub, id, c.bytes, c.name);
      expect(res.status, `${c.name}: ${res.text}`).toBe(c.status);
      expect(res.body.error.message, c.name).toMatch(c.message);
      expect(res.body.error.fields?.file, c.name).toBeTruthy();
    }
    const noFile = await sub.send('post', `/api/requests/${id}/datasets`, {});
    expect(noFile.status).toBe(400);
    expect(noFile.body.error.message).toMatch(/form field "file"/);
    expect(await Dataset.count()).toBe(before);

    // A byte-order mark is fine.
    const bom = await upload(sub, id, Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from('code,score\nA1,3\nA2,5\n')]), 'bom.csv');
    expect(bom.status, bom.text).toBe(201);
    expect(bom.body.columns.map((c: { name: string }) => c.name)).toEqual(['code', 'score']);
    const tsv = await upload(sub, id, Buffer.from('code\tgroup\tscore\nA1\tx\t3.5\nA2\ty\tNA\n'), 'scores.tsv');
    expect(tsv.status, tsv.text).toBe(201);
    expect(tsv.body.columns.find((c: { name: string }) => c.name === 'score')).toMatchObject({ kind: 'numeric', missing: 1, min: 3.5, max: 3.5 });
    expect(await Dataset.count()).toBe(before + 2);
  });

  it('refuses a file over UPLOAD_MAX_BYTES with 413 and stores nothing', async () => {
    process.env['UPLOAD_MAX_BYTES'] = '1024';
    const small = h.appWith({ UPLOAD_MAX_BYTES: '1024' });
    delete process.env['UPLOAD_MAX_BYTES'];
    const c = new ApiClient(small);
    expect((await c.login(emailOf('submitter'), TEST_PASSWORD)).status).toBe(200);
    const { id } = await newDraft(c, 'Oversize upload');
    const before = await Dataset.count();
    const res = await upload(c, id, fixture('advising-pilot.csv'), 'advising-pilot.csv');
    expect(res.status, res.text).toBe(413);
    expect(res.body.error.message).toMatch(/larger than the upload limit of 1 KB/);
    expect(await Dataset.count()).toBe(before);
    const ok = await upload(c, id, Buffer.from('code,score\nA1,3\nA2,5\n'), 'tiny.csv');
    expect(ok.status).toBe(201);
  });

  it('blocks submission on an e-mail column until it is confirmed with a reason, then files the request', async () => {
    const { id } = await newDraft(sub, 'Advising pilot: first-generation students');
    await patch(sub, id, {
      plan: plan({ designKind: 'two-independent', outcome: 'credits_completed', between: [{ column: 'first_generation', levels: ['yes', 'no'] }] }),
      reported: [{ term: 'first_generation', text: 't(87) = 1.20, p = .23' }],
    });
    const src = lines(fixture('advising-pilot.csv'));
    const withEmail = [`${src[0]},email`, ...src.slice(1).map((l, i) => `${l},s${String(i + 1).padStart(4, '0')}@students.harrowvale.test`)].join('\n');
    const up = await upload(sub, id, Buffer.from(withEmail), 'advising-with-email.csv');
    expect(up.status, up.text).toBe(201);
    expect(up.body.identifierFindings.map((f: { column: string }) => f.column).sort()).toEqual(['email', 'student_id']);
    expect(up.body.blocked).toBe(true);

    const blocked = await sub.send('post', `/api/requests/${id}/submit`, { version: await versionOf(id) });
    expect(blocked.status, blocked.text).toBe(422);
    expect(blocked.body.error.code).toBe('validation');
    expect(blocked.body.error.fields.dataset).toMatch(/"email" look like e-mail addresses/);
    expect(Object.keys(blocked.body.error.fields)).toEqual(['dataset']);

    const short = await sub.send('post', `/api/requests/${id}/datasets/${up.body.id}/identifiers`, { confirmations: [{ column: 'email', reason: 'needed' }] });
    expect(short.status).toBe(400);
    expect(short.body.error.fields['confirmations.0.reason']).toMatch(/at least 10 characters/);
    const wrong = await sub.send('post', `/api/requests/${id}/datasets/${up.body.id}/identifiers`, { confirmations: [{ column: 'hs_gpa', reason: CONFIRM_REASON }] });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.fields['confirmations.0.column']).toMatch(/"hs_gpa" was not flagged/);
    expect((await confirmFlagged(sub, id, up.body)).blocked).toBe(false);

    const notesBefore = await Notification.count({ where: { requestId: id, kind: 'request.filed' } });
    const ok = await sub.send('post', `/api/requests/${id}/submit`, { version: await versionOf(id) });
    expect(ok.status, ok.text).toBe(200);
    expect(ok.body.state).toBe('filed');
    expect(ok.body.filedAt).toBeTruthy();
    const v = await RequestVersion.findAll({ where: { requestId: id } });
    expect(v).toHaveLength(1);
    expect(v[0].revisionNo).toBe(1);
    expect(v[0].snapshot).toMatchObject({ title: 'Advising pilot: first-generation students', datasetId: up.body.id, datasetSha256: up.body.sha256, enginePlan: { design: 'independent', outcome: 'credits_completed', between: ['first_generation'] } });
    const headId = await h.userId('head');
    expect(await Notification.count({ where: { requestId: id, kind: 'request.filed', userId: headId } })).toBe(notesBefore + 1);
    const ref = ok.body.reference as string;
    const mail = await waitForMail((m) => m.to.includes(emailOf('head')) && m.subject.includes(ref), 10_000);
    expect(mail.text).toContain(ref);

    const versions = await sub.get(`/api/requests/${id}/versions`);
    expect(versions.body).toEqual([expect.objectContaining({ revisionNo: 1, datasetIds: [up.body.id], rerunIds: [], reason: null })]);
    expect(versions.body[0].createdBy.email).toBe(emailOf('submitter'));
    const head = await h.as('head');
    const snap = await head.get(`/api/requests/${id}/versions/1`);
    expect(snap.status).toBe(200);
    expect(snap.body.snapshot.reported).toEqual([{ term: 'first_generation', text: 't(87) = 1.20, p = .23' }]);
    expect((await head.get(`/api/requests/${id}/versions/2`)).status).toBe(404);
    // Filed data stay as filed.
    const late = await upload(sub, id, fixture('advising-pilot.csv'), 'late.csv');
    expect(late.status).toBe(409);
  });

  it('unblocks when a clean file replaces the one with identifiers', async () => {
    const { id } = await newDraft(sub, 'Advising pilot, clean file');
    await patch(sub, id, { plan: plan({ designKind: 'two-independent', outcome: 'credits_completed', between: [{ column: 'first_generation', levels: [] }] }) });
    const src = lines(fixture('advising-pilot.csv'));
    const first = await upload(sub, id, Buffer.from([`${src[0]},email`, ...src.slice(1).map((l, i) => `${l},p${i}@mail.harrowvale.test`)].join('\n')), 'a.csv');
    expect(first.body.blocked).toBe(true);
    // The clean copy drops the e-mail column and names the code column neutrally.
    const clean = [src[0].replace('student_id', 'code'), ...src.slice(1)].join('\n');
    const second = await upload(sub, id, Buffer.from(clean), 'clean.csv');
    expect(second.status).toBe(201);
    expect(second.body).toMatchObject({ blocked: false, identifierFindings: [] });
    const ok = await sub.send('post', `/api/requests/${id}/submit`, { version: await versionOf(id) });
    expect(ok.status, ok.text).toBe(200);
    const v = await RequestVersion.findOne({ where: { requestId: id }, rejectOnEmpty: true });
    expect((v.snapshot as { datasetId: string }).datasetId).toBe(second.body.id);
  });

  it('reshapes a wide repeated-measures file to long and files a repeated-measures plan on it', async () => {
    const { id } = await newDraft(sub, 'Belonging, four waves (wide file)');
    const long = lines(fixture('belonging-survey.csv')).slice(1).map((l) => l.split(','));
    const students = [...new Set(long.map((r) => r[0]))];
    const wide = ['student_id,w1,w2,w3,w4', ...students.map((s) => [s, ...['1', '2', '3', '4'].map((w) => long.find((r) => r[0] === s && r[1] === w)![2])].join(','))].join('\n');
    const up = await upload(sub, id, Buffer.from(wide), 'belonging-wide.csv');
    expect(up.status, up.text).toBe(201);
    await confirmFlagged(sub, id, up.body);

    const bad = await sub.send('post', `/api/requests/${id}/datasets/${up.body.id}/reshape`, { subjectColumn: 'student_id', measureColumns: ['w1', 'w9'], factorName: 'wave', valueName: 'belonging' });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields['measureColumns.1']).toMatch(/"w9" is not in the data/);
    const text = await sub.send('post', `/api/requests/${id}/datasets/${up.body.id}/reshape`, { subjectColumn: 'w1', measureColumns: ['student_id', 'w2'], factorName: 'wave', valueName: 'belonging' });
    expect(text.status).toBe(422);
    expect(text.body.error.fields['measureColumns.0']).toMatch(/"student_id" is not numeric/);

    const before = await Dataset.count();
    const res = await sub.send('post', `/api/requests/${id}/datasets/${up.body.id}/reshape`, {
      subjectColumn: 'student_id', measureColumns: ['w1', 'w2', 'w3', 'w4'], factorName: 'wave', valueName: 'belonging', levels: ['1', '2', '3', '4'],
    });
    expect(res.status, res.text).toBe(201);
    expect(await Dataset.count()).toBe(before + 1);
    expect(res.body).toMatchObject({ derivedFrom: up.body.id, rows: long.length, blocked: false });
    expect(res.body.columns.map((c: { name: string }) => c.name)).toEqual(['student_id', 'wave', 'belonging']);
    // The long file holds exactly the demo study's rows.
    const file = await sub.agent.get(`/api/requests/${id}/datasets/${res.body.id}/file`);
    const got = file.text.trim().split(/\r?\n/).slice(1).map((l) => l.split(',').join('|')).sort();
    expect(got).toEqual(long.map((r) => r.join('|')).sort());

    await patch(sub, id, { plan: plan({ designKind: 'repeated-measures', outcome: 'belonging', subject: 'student_id', within: [{ column: 'wave', levels: ['1', '2', '3', '4'] }], comparisons: [{ factor: 'wave', method: 'bonferroni' }], submitterCorrection: 'bonferroni' }) });
    const ok = await sub.send('post', `/api/requests/${id}/submit`, { version: await versionOf(id) });
    expect(ok.status, ok.text).toBe(200);
    expect(ok.body.state).toBe('filed');
    const v = await RequestVersion.findOne({ where: { requestId: id }, rejectOnEmpty: true });
    expect(v.snapshot).toMatchObject({ datasetId: res.body.id, enginePlan: { design: 'anova', within: ['wave'], subject: 'student_id' } });
  });

  it('reports submit problems per field and changes nothing', async () => {
    const { id } = await newDraft(sub, 'Problems on submit', { purpose: '' });
    const onlyFall = lines(fixture('course-modality.csv')).filter((l, i) => i === 0 || l.includes(',fall,')).join('\n').replace('student_id', 'code');
    const up = await upload(sub, id, Buffer.from(onlyFall), 'fall.csv');
    expect(up.status, up.text).toBe(201);
    const submit = async () => sub.send('post', `/api/requests/${id}/submit`, { version: await versionOf(id) });

    await patch(sub, id, { plan: plan({ designKind: 'between-anova', between: [{ column: 'modality', levels: [] }] }) });
    let res = await submit();
    expect(res.status).toBe(422);
    expect(res.body.error.fields).toMatchObject({ purpose: expect.stringMatching(/purpose/), 'plan.outcome': 'Choose the outcome column.' });

    await patch(sub, id, {
      purpose: 'Final scores by section type in the autumn term.',
      plan: plan({ designKind: 'between-anova', outcome: 'final_grade', between: [{ column: 'modality', levels: ['in-person', 'studio'] }] }),
      reported: [{ term: 'modality', text: 'F(2, 60) = 3.1, p = .05' }, { text: 'the effect was large' }],
    });
    res = await submit();
    expect(res.status).toBe(422);
    expect(res.body.error.fields['plan.outcome']).toMatch(/Column "final_grade" is not in the data file fall.csv \(its columns: code, modality, term, final_score\)/);
    expect(res.body.error.fields['plan.between.0.levels']).toMatch(/Level "studio" of "modality" does not occur in the data/);
    expect(res.body.error.fields['reported.1']).toMatch(/Could not read "the effect was large"/);
    expect(res.body.error.fields['reported.0']).toBeUndefined();
    expect(res.body.error.fields.purpose).toBeUndefined();

    // The engine's own refusal (a factor with one level) comes back beside the factor.
    await patch(sub, id, {
      plan: plan({ designKind: 'between-anova', outcome: 'final_score', between: [{ column: 'term', levels: [] }] }),
      reported: [{ term: 'term', text: 'F(1, 60) = 3.1, p = .08' }],
    });
    res = await submit();
    expect(res.status, res.text).toBe(422);
    expect(Object.keys(res.body.error.fields)).toEqual(['plan.between.0']);
    expect(res.body.error.fields['plan.between.0']).toMatch(/cannot run on these data: .*term has only one level \('fall'\)/);

    const r = await ReviewRequest.findByPk(id, { rejectOnEmpty: true });
    expect(r.state).toBe('draft');
    expect(await RequestVersion.count({ where: { requestId: id } })).toBe(0);

    const badPlan = await sub.send('patch', `/api/requests/${id}`, { plan: { designKind: 'anova', alpha: 2 }, version: r.version });
    expect(badPlan.status).toBe(400);
    expect(badPlan.body.error.fields['plan.designKind']).toMatch(/must be one of/);
    expect(badPlan.body.error.fields['plan.alpha']).toMatch(/below 0.5/);
  });

  it('answers 409 on a stale version and leaves the request as it was', async () => {
    const { id } = await newDraft(sub, 'Stale submit');
    await upload(sub, id, Buffer.from([fixture('advising-pilot.csv').toString().replace('student_id', 'code')].join('')), 'a.csv');
    const old = await versionOf(id);
    await patch(sub, id, { plan: plan({ designKind: 'two-independent', outcome: 'credits_completed', between: [{ column: 'first_generation', levels: [] }] }) });
    const res = await sub.send('post', `/api/requests/${id}/submit`, { version: old });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('conflict');
    expect((await ReviewRequest.findByPk(id, { rejectOnEmpty: true })).state).toBe('draft');
    const w = await sub.send('post', `/api/requests/${id}/withdraw`, { version: old, reason: 'No longer needed.' });
    expect(w.status).toBe(409);
  });

  it('files a revision as the next revision, back in review, keeping the old one readable', async () => {
    const analyst = await h.as('analyst-support');
    const id = await h.requestId('HV-2026-005');
    const before = await analyst.get(`/api/requests/${id}`);
    expect(before.body.state).toBe('revision-requested');
    const oldData = before.body.datasets[0].id as string;
    const del = await analyst.send('delete', `/api/requests/${id}/datasets/${oldData}`);
    expect(del.status).toBe(409);
    const up = await upload(analyst, id, fixture('peer-tutoring.csv'), 'peer-tutoring-v2.csv');
    expect(up.status, up.text).toBe(201);
    expect(up.body.revisionNo).toBe(2);
    await confirmFlagged(analyst, id, up.body);
    await revisionRequests().create({ requestId: id, revisionNo: 1, changes: ['Report the sphericity check.', 'Describe how tutored students self-selected.'], message: '', requestedById: await h.userId('reviewer') });
    const res = await analyst.send('post', `/api/requests/${id}/submit`, { version: before.body.version, note: 'Sphericity check and correction reported.' });
    expect(res.status, res.text).toBe(200);
    expect(res.body.state).toBe('in-review');
    const r = await ReviewRequest.findByPk(id, { rejectOnEmpty: true });
    expect(r.revisionNo).toBe(2);
    const versions = (await analyst.get(`/api/requests/${id}/versions`)).body;
    expect(versions.map((v: { revisionNo: number }) => v.revisionNo)).toEqual([1, 2]);
    expect(versions[1].datasetIds).toEqual([up.body.id]);
    expect(versions[0].datasetIds).toContain(oldData);
    expect(versions[1].reason).toBe('Report the sphericity check.\nDescribe how tutored students self-selected.');
    // Reruns are listed under the revision they ran on (reruns.revisionNo).
    const seeded = await h.sequelize.query<{ id: string }>('SELECT id FROM reruns WHERE requestId = ? ORDER BY createdAt, id', { replacements: [id], type: QueryTypes.SELECT });
    expect(versions[0].rerunIds).toEqual(seeded.map((x) => x.id));
    expect(versions[1].rerunIds).toEqual([]);
    const reviewer = await h.as('reviewer');
    const v1 = await reviewer.get(`/api/requests/${id}/versions/1`);
    expect(v1.status).toBe(200);
    const v2 = await reviewer.get(`/api/requests/${id}/versions/2`);
    expect(v2.body.snapshot).toMatchObject({ note: 'Sphericity check and correction reported.', datasetId: up.body.id, plan: { designKind: 'mixed', outcome: 'score' } });
    expect(await Notification.count({ where: { requestId: id, kind: 'request.resubmitted', userId: await h.userId('reviewer') } })).toBe(1);
    expect((await reviewer.get(`/api/requests/${id}/datasets/${oldData}`)).status).toBe(200);
  });

  it('withdraws a request with a reason, once', async () => {
    const { id } = await newDraft(sub, 'To be withdrawn');
    const noReason = await sub.send('post', `/api/requests/${id}/withdraw`, { version: await versionOf(id) });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields.reason).toBeTruthy();
    const res = await sub.send('post', `/api/requests/${id}/withdraw`, { version: await versionOf(id), reason: 'The pilot was cancelled.' });
    expect(res.status, res.text).toBe(200);
    expect(res.body.state).toBe('withdrawn');
    const again = await sub.send('post', `/api/requests/${id}/withdraw`, { version: await versionOf(id), reason: 'Again.' });
    expect(again.status).toBe(409);
    const decided = await h.requestId('HV-2026-001');
    const d = await sub.send('post', `/api/requests/${decided}/withdraw`, { version: await versionOf(decided), reason: 'Too late for this.' });
    expect(d.status).toBe(409);
  });

  it('enforces ownership and roles', async () => {
    const { id } = await newDraft(sub, 'Access checks');
    const up = await upload(sub, id, Buffer.from('code,score\nA1,3\nA2,5\n'), 'a.csv');
    const other = await h.as('analyst-writing');
    expect((await other.get(`/api/requests/${id}/datasets`)).status).toBe(404);
    expect((await other.get(`/api/requests/${id}/datasets/${up.body.id}/file`)).status).toBe(404);
    expect((await upload(other, id, Buffer.from('a,b\n1,2\n'), 'x.csv')).status).toBe(404);
    expect((await other.send('post', `/api/requests/${id}/submit`, { version: 0 })).status).toBe(404);
    expect((await other.send('delete', `/api/requests/${id}/datasets/${up.body.id}`)).status).toBe(404);

    const inReview = await h.requestId('HV-2026-004');
    const reviewer = await h.as('reviewer');
    const before = await Dataset.count();
    expect((await reviewer.get(`/api/requests/${inReview}/datasets`)).status).toBe(200);
    const rUp = await upload(reviewer, inReview, Buffer.from('a,b\n1,2\n'), 'x.csv');
    expect(rUp.status).toBe(403);
    expect((await reviewer.send('post', `/api/requests/${inReview}/submit`, { version: await versionOf(inReview) })).status).toBe(403);
    expect((await reviewer.send('post', `/api/requests/${inReview}/withdraw`, { version: await versionOf(inReview), reason: 'Not mine.' })).status).toBe(403);
    const head = await h.as('head');
    expect((await upload(head, await h.requestId('HV-2026-003'), Buffer.from('a,b\n1,2\n'), 'x.csv')).status).toBe(403);
    expect((await upload(sub, await h.requestId('HV-2026-003'), Buffer.from('a,b\n1,2\n'), 'x.csv')).status).toBe(409);
    expect(await Dataset.count()).toBe(before);
    expect((await h.client().get(`/api/requests/${id}/datasets`)).status).toBe(401);

    const del = await sub.send('delete', `/api/requests/${id}/datasets/${up.body.id}`);
    expect(del.status).toBe(204);
    expect((await sub.get(`/api/requests/${id}/datasets`)).body).toEqual([]);
  });
});
