/**
 * Signed letters through the API: the seeded demo letter, signing letters for two more
 * designs (repeated measures and paired), verification by code and by upload, a flipped
 * byte, amendment and supersession, the countersignature, errors for unknown codes,
 * non-PDF and oversize uploads, access to the PDF, the e-mail, and rendering to PNG.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { CRITERIA, type Decision } from '../../shared/api/types';
import type { LetterView, VerificationView } from '../../shared/api/workflow';
import { runPlan } from '../../shared/stats/rerun';
import { MAX_VERIFY_BYTES, newVerificationCode, rotateKeys } from '../../server/letters/index';
import { ChecklistEntry, Dataset, DecisionRow, Letter, Office, Rerun, ReviewRequest, User } from '../../server/models/index';
import { enginePlanOf } from '../../server/services/letter-compose';
import { forgetOfficeKeys } from '../../server/services/office-keys';
import { readTableBytes } from '../../server/tabular/index';
import type { ApiClient } from './support/client';
import { waitForMail } from './support/mail';
import { emailOf, TEST_PASSWORD, useApiHarness } from './support/harness';

// One keys directory for the seed (which signs the demo letter) and the app, so the demo letter verifies.
const keysDir = fs.mkdtempSync(path.join(os.tmpdir(), 'assayer-letter-keys-'));
const previousKeysDir = process.env['ASSAYER_KEYS_DIR'];
process.env['ASSAYER_KEYS_DIR'] = keysDir;
forgetOfficeKeys();

afterAll(() => {
  if (previousKeysDir === undefined) delete process.env['ASSAYER_KEYS_DIR'];
  else process.env['ASSAYER_KEYS_DIR'] = previousKeysDir;
  forgetOfficeKeys();
  fs.rmSync(keysDir, { recursive: true, force: true });
});

/** Puts a request straight into "decided" the way the review service leaves it: a done rerun, every verdict, a decision. */
async function decideDirectly(reference: string, reviewerId: string, decision: Decision, conditions: string[]): Promise<string> {
  const r = await ReviewRequest.findOne({ where: { reference }, rejectOnEmpty: true });
  let rerun = await Rerun.findOne({ where: { requestId: r.id, status: 'done' } });
  if (!rerun) {
    const ds = await Dataset.scope('withBytes').findOne({ where: { requestId: r.id }, rejectOnEmpty: true });
    const plan = enginePlanOf(r.plan, (r.reported as { text: string }[] | null) ?? []);
    if (!plan) throw new Error(`${reference} has no plan`);
    const result = runPlan(plan, await readTableBytes(ds.bytes, ds.filename));
    rerun = await Rerun.create({
      requestId: r.id, datasetId: ds.id, label: 'as filed', status: 'done', engineVersion: result.engine, planSnapshot: plan as never, dataSha256: ds.sha256,
      timings: null, result: result as never, error: null, startedById: reviewerId, startedAt: new Date(), finishedAt: new Date(),
    });
  }
  for (const criterion of CRITERIA) {
    const [row] = await ChecklistEntry.findOrCreate({ where: { requestId: r.id, criterion }, defaults: { requestId: r.id, criterion, verdict: null, note: '', autoFinding: null, rerunId: rerun.id, reviewerId } });
    await row.update({ verdict: criterion === 'sphericity' ? 'not-applicable' : 'met', note: `Checked ${criterion} on the rerun.` });
  }
  await DecisionRow.create({ requestId: r.id, decision, conditions, rationale: 'The analysis fits the design and reproduces from the data.', decidedById: reviewerId, decidedAt: new Date() });
  await r.update({ state: 'decided', decidedAt: new Date() });
  return r.id;
}

/** Walks the checklist and records the decision through the review API, as the reviewer's screens do. */
async function decideViaApi(reviewer: ApiClient, id: string, decision: Decision, conditions: string[]): Promise<void> {
  for (const criterion of CRITERIA) {
    const put = await reviewer.send('put', `/api/requests/${id}/checklist/${criterion}`, { verdict: 'met', note: `Checked ${criterion} on the rerun.`, version: 0 });
    expect(put.status, put.text).toBe(200);
  }
  const version = (await reviewer.get(`/api/requests/${id}`)).body.version as number;
  const decided = await reviewer.send('post', `/api/requests/${id}/decision`, { decision, conditions, rationale: 'The analysis fits the design and reproduces from the data.', version });
  expect([200, 201], decided.text).toContain(decided.status);
}

const upload = (app: Express, pdf: Buffer, filename = 'letter.pdf') => request(app).post('/api/letters/verify').attach('file', pdf, filename);

describe('signed recommendation letters', () => {
  const h = useApiHarness();
  let rmId: string;
  let rmLetter: LetterView;
  let rmPdf: Buffer;

  it('the seeded decided request carries a signed letter the submitter downloads and anyone verifies', async () => {
    const id = await h.requestId('HV-2026-001');
    const submitter = await h.as('submitter');
    const list = await submitter.get(`/api/requests/${id}/letters`);
    expect(list.status).toBe(200);
    const letters = list.body as LetterView[];
    expect(letters).toHaveLength(1);
    expect(letters[0]).toMatchObject({ letterNo: 1, status: 'issued', decision: 'endorse-with-conditions', supersededBy: null });
    expect(letters[0].verifyUrl).toMatch(new RegExp(`/verify/${letters[0].code}$`));

    const pdf = await submitter.agent.get(letters[0].downloadUrl).buffer(true).parse((res, cb) => { const parts: Buffer[] = []; res.on('data', (c: Buffer) => parts.push(c)); res.on('end', () => cb(null, Buffer.concat(parts))); });
    expect(pdf.status).toBe(200);
    expect(pdf.headers['content-type']).toBe('application/pdf');
    expect(pdf.headers['content-disposition']).toMatch(/^attachment; filename="HV-2026-001-letter-v1-[0-9A-Z-]+\.pdf"$/);
    const body = pdf.body as Buffer;
    expect(body.subarray(0, 5).toString()).toBe('%PDF-');

    const anonymous = h.client();
    const byCode = await anonymous.get(`/api/letters/${letters[0].code.toLowerCase().replace(/-/g, ' ')}`);
    expect(byCode.status).toBe(200);
    expect((byCode.body as VerificationView)).toMatchObject({ status: 'valid-current', code: letters[0].code, letter: { reference: 'HV-2026-001', letterNo: 1, decision: 'endorse-with-conditions', supersededBy: null } });
    const byUpload = await upload(h.app, body);
    expect(byUpload.status).toBe(200);
    expect((byUpload.body as VerificationView).status).toBe('valid-current');
  });

  it('the reviewer signs only after a deliberate confirmation; a wrong reference or password signs nothing', async () => {
    rmId = await h.requestId('HV-2026-004');
    const reviewer = await h.as('reviewer');
    expect((await reviewer.send('post', `/api/requests/${rmId}/letter/sign`, { confirmReference: 'HV-2026-004', password: TEST_PASSWORD })).status).toBe(409);
    await decideViaApi(reviewer, rmId, 'endorse-with-conditions', ['Report the Greenhouse–Geisser corrected degrees of freedom.']);
    const before = await Letter.count();
    const submitter = await h.as('submitter');
    expect((await submitter.send('post', `/api/requests/${rmId}/letter/sign`, { confirmReference: 'HV-2026-004', password: TEST_PASSWORD })).status).toBe(403);

    const wrongRef = await reviewer.send('post', `/api/requests/${rmId}/letter/sign`, { confirmReference: 'HV-2026-001', password: TEST_PASSWORD });
    expect(wrongRef.status).toBe(400);
    expect(wrongRef.body.error.fields.confirmReference).toMatch(/HV-2026-004/);
    const noPassword = await reviewer.send('post', `/api/requests/${rmId}/letter/sign`, { confirmReference: 'HV-2026-004' });
    expect(noPassword.status).toBe(400);
    expect(noPassword.body.error.fields.password).toMatch(/password/i);
    const wrongPassword = await reviewer.send('post', `/api/requests/${rmId}/letter/sign`, { confirmReference: 'HV-2026-004', password: 'not-the-password' });
    expect(wrongPassword.status).toBe(400);
    expect(wrongPassword.body.error.code).toBe('reauth-failed');
    const noToken = await reviewer.send('post', `/api/requests/${rmId}/letter/sign`, { confirmReference: 'HV-2026-004', password: TEST_PASSWORD }, { csrf: false });
    expect(noToken.status).toBe(403);
    expect(await Letter.count()).toBe(before);

    const signed = await reviewer.send('post', `/api/requests/${rmId}/letter/sign`, { confirmReference: ' hv-2026-004 ', password: TEST_PASSWORD });
    expect(signed.status).toBe(201);
    rmLetter = signed.body.letter as LetterView;
    expect(rmLetter).toMatchObject({ letterNo: 1, status: 'issued', decision: 'endorse-with-conditions', signedBy: { email: emailOf('reviewer') }, countersignedBy: null });
    expect(signed.body.message).toMatch(/password/);
    const again = await reviewer.send('post', `/api/requests/${rmId}/letter/sign`, { confirmReference: 'HV-2026-004', password: TEST_PASSWORD });
    expect(again.status).toBe(409);
    const row = await Letter.findOne({ where: { verificationCode: rmLetter.code }, rejectOnEmpty: true });
    const audit = await h.sequelize.query<{ action: string }>("SELECT action FROM audit_log WHERE action = 'letter.issued' AND entityId = ?", { replacements: [row.id], type: QueryTypes.SELECT });
    expect(audit).toHaveLength(1);
    // The letter quotes the rerun the decision rests on.
    const [decided] = await h.sequelize.query<{ rerunId: string }>('SELECT rerunId FROM decisions WHERE requestId = ?', { replacements: [rmId], type: QueryTypes.SELECT });
    expect((row.record as { rerun: { id: string } }).rerun.id).toBe(decided.rerunId);
  });

  it('the submitter is told by e-mail with a link to the request, not an attachment', async () => {
    const mail = await waitForMail((m) => m.to.includes(emailOf('submitter')) && m.subject.includes('HV-2026-004') && /letter/i.test(m.subject));
    expect(mail.text).toContain(`/requests/${rmId}`);
    expect(mail.text).toMatch(/https?:\/\//);
    // The fake SMTP server keeps text and HTML only; an attached PDF would show up as its bytes or a pdf part in neither.
    expect(`${mail.text}${mail.html ?? ''}`).not.toMatch(/%PDF-|application\/pdf/);
  });

  it('verifies a downloaded letter by upload and by code, and reports a flipped byte as altered', async () => {
    const submitter = await h.as('submitter');
    const res = await submitter.agent.get(rmLetter.downloadUrl).buffer(true).parse((r, cb) => { const p: Buffer[] = []; r.on('data', (c: Buffer) => p.push(c)); r.on('end', () => cb(null, Buffer.concat(p))); });
    expect(res.status).toBe(200);
    rmPdf = res.body as Buffer;
    const ok = await upload(h.app, rmPdf);
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ status: 'valid-current', code: rmLetter.code, letter: { reference: 'HV-2026-004' } });
    expect((ok.body as VerificationView).headline).toMatch(/authentic and current/);

    const flipped = Buffer.from(rmPdf);
    const at = Math.floor(flipped.length / 3);
    flipped[at] = flipped[at] ^ 0x20;
    const altered = await upload(h.app, flipped);
    expect(altered.status).toBe(200);
    expect((altered.body as VerificationView).status).toBe('altered');
    expect((altered.body as VerificationView).details.join(' ')).toMatch(/SHA-256|signature/);
  });

  it('answers an unknown code, a malformed code, a non-PDF, a missing file and an oversize upload with clear errors', async () => {
    const anonymous = h.client();
    let unknown = newVerificationCode();
    while (await Letter.count({ where: { verificationCode: unknown } })) unknown = newVerificationCode();
    const u = await anonymous.get(`/api/letters/${unknown}`);
    expect(u.status).toBe(404);
    expect(u.body).toMatchObject({ status: 'unknown-code', code: unknown });
    expect(u.body.headline).toMatch(/No letter with the code/);

    const bad = await anonymous.get('/api/letters/ABC-123');
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/12 characters/);

    const text = await upload(h.app, Buffer.from('student_id,score\nS1,4\n'), 'letter.pdf');
    expect(text.status).toBe(415);
    expect(text.body).toMatchObject({ status: 'not-a-pdf' });
    expect(text.body.headline).toMatch(/not a PDF/);

    const foreign = await upload(h.app, Buffer.from('%PDF-1.4\n1 0 obj\n<< /Type /Catalog >>\nendobj\ntrailer\n<< /Root 1 0 R >>\n%%EOF\n'));
    expect(foreign.status).toBe(200);
    expect(foreign.body).toMatchObject({ status: 'unknown-code' });
    expect(foreign.body.headline).toMatch(/no verification code of this office/);

    const none = await request(h.app).post('/api/letters/verify').field('note', 'no file');
    expect(none.status).toBe(400);
    expect(none.body.error.message).toMatch(/field "file"/);

    const big = Buffer.alloc(MAX_VERIFY_BYTES + 1, 0x20);
    big.write('%PDF-1.7\n');
    const tooBig = await upload(h.app, big);
    expect(tooBig.status).toBe(413);
    expect(tooBig.body.error.message).toMatch(/larger than 10 MB/);
  });

  it('the PDF follows the request access rules: another submitter and anonymous visitors do not get it', async () => {
    const other = await h.as('analyst-writing');
    expect((await other.get(rmLetter.downloadUrl)).status).toBe(404);
    expect((await other.get(`/api/requests/${rmId}/letters`)).status).toBe(404);
    expect((await h.client().get(rmLetter.downloadUrl)).status).toBe(401);
    const admin = await h.as('admin');
    expect((await admin.get(`/api/requests/${rmId}/letters`)).status).toBe(200);
    expect((await admin.send('post', `/api/requests/${rmId}/letter/amend`, { decision: 'endorse', conditions: [], rationale: 'x', reason: 'x', confirmReference: 'HV-2026-004', password: TEST_PASSWORD })).status).toBe(403);
  });

  it('an amendment issues a new version; the old one verifies as superseded and the new one as current', async () => {
    const reviewer = await h.as('reviewer');
    const missing = await reviewer.send('post', `/api/requests/${rmId}/letter/amend`, { decision: 'endorse-with-conditions', conditions: [], rationale: 'r', reason: '', confirmReference: 'HV-2026-004', password: TEST_PASSWORD });
    expect(missing.status).toBe(400);
    expect(Object.keys(missing.body.error.fields)).toEqual(expect.arrayContaining(['reason', 'conditions']));

    const amended = await reviewer.send('post', `/api/requests/${rmId}/letter/amend`, {
      decision: 'endorse', conditions: [], rationale: 'The submitter reported the corrected degrees of freedom; no condition remains.',
      reason: 'Condition met before publication.', confirmReference: 'HV-2026-004', password: TEST_PASSWORD,
    });
    expect(amended.status).toBe(201);
    const v2 = amended.body.letter as LetterView;
    expect(v2).toMatchObject({ letterNo: 2, status: 'issued', decision: 'endorse' });

    const list = (await reviewer.get(`/api/requests/${rmId}/letters`)).body as LetterView[];
    expect(list.map((l) => [l.letterNo, l.status, l.supersededBy])).toEqual([[2, 'issued', null], [1, 'superseded', v2.code]]);

    const old = await h.client().get(`/api/letters/${rmLetter.code}`);
    expect(old.body).toMatchObject({ status: 'valid-superseded', letter: { supersededBy: v2.code } });
    const oldUpload = await upload(h.app, rmPdf);
    expect(oldUpload.body).toMatchObject({ status: 'valid-superseded' });
    expect((await h.client().get(`/api/letters/${v2.code}`)).body).toMatchObject({ status: 'valid-current', letter: { letterNo: 2, decision: 'endorse' } });
  });

  it('with countersigning required, the letter is issued only when the head countersigns', async () => {
    const office = await Office.findOne({ rejectOnEmpty: true });
    const settings = office.settings;
    await office.update({ settings: { ...settings, countersignRequired: true } });
    const headUser = await User.findOne({ where: { email: emailOf('head') }, rejectOnEmpty: true });
    const headHash = headUser.passwordHash;
    try {
      const id = await decideDirectly('HV-2026-002', await h.userId('reviewer2'), 'endorse', []);
      const reviewer2 = await h.as('reviewer2');
      const otherTab = await h.as('reviewer2');
      // Two signing attempts at once (two tabs): the request row lock lets exactly one through.
      const both = await Promise.all([reviewer2, otherTab].map((c) => c.send('post', `/api/requests/${id}/letter/sign`, { confirmReference: 'HV-2026-002', password: TEST_PASSWORD })));
      expect(both.map((b) => b.status).sort()).toEqual([201, 409]);
      expect(await Letter.count({ where: { requestId: id } })).toBe(1);
      const signed = both.find((b) => b.status === 201)!;
      const pending = signed.body.letter as LetterView;
      expect(pending.status).toBe('awaiting-countersign');
      expect((await h.client().get(`/api/letters/${pending.code}`)).status).toBe(404);
      expect((await reviewer2.get(pending.downloadUrl)).status).toBe(404);
      await waitForMail((m) => m.to.includes(emailOf('head')) && m.subject.includes('Countersignature needed: HV-2026-002'));

      expect((await reviewer2.send('post', `/api/requests/${id}/letter/countersign`, { confirmReference: 'HV-2026-002', password: TEST_PASSWORD })).status).toBe(403);
      // The head signs in through single sign-on only: typing the reference is the whole confirmation.
      await headUser.update({ passwordHash: null });
      const head = h.client();
      await head.samlLogin('head');
      expect((await head.get('/api/auth/me')).body.email).toBe(emailOf('head'));
      expect((await head.send('post', `/api/requests/${id}/letter/countersign`, { confirmReference: 'HV-2026-020' })).status).toBe(400);
      const done = await head.send('post', `/api/requests/${id}/letter/countersign`, { confirmReference: 'HV-2026-002' });
      expect(done.status).toBe(200);
      expect(done.body.message).toMatch(/single sign-on/);
      expect(done.body.letter).toMatchObject({ code: pending.code, status: 'issued', signedBy: { email: emailOf('reviewer2') }, countersignedBy: { email: emailOf('head') } });
      const v = (await h.client().get(`/api/letters/${pending.code}`)).body as VerificationView;
      expect(v.status).toBe('valid-current');
      expect(v.letter?.signedBy).toMatch(/countersigned by Ruth Abernethy-Osei/);
      await waitForMail((m) => m.to.includes(emailOf('analyst-writing')) && m.subject.includes('HV-2026-002') && /letter/i.test(m.subject));
    } finally {
      // Signing in changed the row (last sign-in), so reload before restoring the password.
      await headUser.reload();
      await headUser.update({ passwordHash: headHash });
      await office.reload();
      await office.update({ settings: { ...office.settings, countersignRequired: false } });
    }
  });

  it('limits verification requests per address (VERIFY_RATE_LIMIT)', async () => {
    process.env['VERIFY_RATE_LIMIT'] = '2';
    let limited: Express;
    try {
      limited = h.appWith({});
    } finally {
      delete process.env['VERIFY_RATE_LIMIT'];
    }
    expect((await request(limited).get(`/api/letters/${rmLetter.code}`)).status).toBe(200);
    expect((await request(limited).get(`/api/letters/${rmLetter.code}`)).status).toBe(200);
    const third = await request(limited).get(`/api/letters/${rmLetter.code}`);
    expect(third.status).toBe(429);
    expect(third.body.error.code).toBe('rate-limited');
  });

  it('keeps letters verifiable after the office rotates its keys', async () => {
    rotateKeys(keysDir, { officeName: 'Office of Institutional Effectiveness' });
    forgetOfficeKeys();
    const fresh = h.appWith({});
    const old = await request(fresh).get(`/api/letters/${rmLetter.code}`);
    expect(old.body.status).toBe('valid-superseded');
    expect((await upload(fresh, rmPdf)).body.status).toBe('valid-superseded');
  });

  it('renders every page of a signed letter to PNG with pdftoppm', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'assayer-letter-png-'));
    try {
      const pdfPath = path.join(dir, 'letter.pdf');
      fs.writeFileSync(pdfPath, rmPdf);
      const info = execFileSync('pdfinfo', [pdfPath], { encoding: 'utf8' });
      const pages = Number(/^Pages:\s+(\d+)/m.exec(info)?.[1]);
      expect(pages).toBeGreaterThanOrEqual(2);
      execFileSync('pdftoppm', ['-r', '40', '-png', pdfPath, path.join(dir, 'page')]);
      const pngs = fs.readdirSync(dir).filter((f) => f.endsWith('.png')).sort();
      expect(pngs).toHaveLength(pages);
      for (const f of pngs) {
        const png = fs.readFileSync(path.join(dir, f));
        expect(png.subarray(1, 4).toString()).toBe('PNG');
        // A4 at 40 dpi is 331 × 468 pixels (8.27 × 11.69 in); the IHDR chunk holds width and height.
        expect(png.readUInt32BE(16)).toBeGreaterThanOrEqual(320);
        expect(png.readUInt32BE(20)).toBeGreaterThanOrEqual(440);
      }
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});
