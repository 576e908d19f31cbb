/**
 * Intake against a real MariaDB: the workload board, reviewer suggestions, assigning with the
 * conflict-of-interest rule, declining and reassigning, office settings, due-soon reminders,
 * the development outbox, and every notification event reaching the right person by e-mail.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { AssignmentCandidate, NotifyEvent, OfficeSettings, OutboxMail, Workload } from '../../shared/api/workflow';
import { NOTIFY_EVENTS } from '../../shared/api/workflow';
import type { NotificationPage, RequestDetail } from '../../shared/api/types';
import { Assignment, Department, ReviewRequest, User, UserRole } from '../../server/models/index';
import { sendDueSoonReminders } from '../../server/services/due-soon';
import { notifyEvent } from '../../server/services/notify-event';
import { addDays, isoDay } from '../../server/services/workload';
import { DEMO_OFFICE_NAME } from '../../server/db/seed';
import { emailOf, useApiHarness } from './support/harness';
import { mailbox, waitForMail } from './support/mail';

const PUBLIC = 'http://127.0.0.1:4280';

describe('intake and workload', () => {
  const h = useApiHarness();
  let ids: Record<string, string>;
  let ssaReviewerId: string;
  let morganId: string;
  let morganRequestId: string;

  const detail = async (id: string): Promise<RequestDetail> => (await (await h.as('head')).get(`/api/requests/${id}`)).body as RequestDetail;

  beforeAll(async () => {
    ids = {};
    for (const ref of ['HV-2026-001', 'HV-2026-002', 'HV-2026-003', 'HV-2026-004', 'HV-2026-005']) ids[ref] = await h.requestId(ref);
    const head = await User.findOne({ where: { email: emailOf('head') }, rejectOnEmpty: true });
    const ssa = await Department.findOne({ where: { code: 'SSA' }, rejectOnEmpty: true });
    const aca = await Department.findOne({ where: { code: 'ACA' }, rejectOnEmpty: true });
    // A reviewer who works in the same department as the demo submitter (Student Success and Advising).
    const sam = await User.create({ officeId: head.officeId, email: 'sam.okonkwo@demo.test', name: 'Sam Okonkwo', departmentId: ssa.id, passwordHash: null, samlNameId: null, expertise: ['between-anova'], lastSignInAt: null });
    await UserRole.create({ userId: sam.id, role: 'reviewer', source: 'manual' });
    ssaReviewerId = sam.id;
    // A reviewer who also files requests, and has filed one.
    const morgan = await User.create({ officeId: head.officeId, email: 'morgan.felde@demo.test', name: 'Morgan Felde', departmentId: aca.id, passwordHash: null, samlNameId: null, expertise: ['regression'], lastSignInAt: null });
    await UserRole.create({ userId: morgan.id, role: 'reviewer', source: 'manual' });
    await UserRole.create({ userId: morgan.id, role: 'submitter', source: 'manual' });
    morganId = morgan.id;
    const r = await ReviewRequest.create({
      officeId: head.officeId, reference: 'HV-2026-090', title: 'Placement <scores> & retention', state: 'filed', designKind: 'regression', departmentId: aca.id,
      submitterId: morgan.id, purpose: 'Invented test request.', decisionInformed: '', audience: '', samplingNotes: '', deadline: null, plan: null, reported: null, filedAt: new Date(), decidedAt: null,
    });
    morganRequestId = r.id;
  });

  describe('workload board', () => {
    it('counts open, due-soon and overdue reviews and the turnaround of the seeded office', async () => {
      const res = await (await h.as('head')).get('/api/workload');
      expect(res.status).toBe(200);
      const w = res.body as Workload;
      expect(w.serviceLevelDays).toBe(15);
      expect(w.unassigned).toBe(2); // HV-2026-003 and the test's HV-2026-090
      const by = (key: string) => w.reviewers.find((r) => r.reviewer.email === emailOf(key))!;
      // reviewer: HV-2026-004 in review due in 2 days (due soon) and HV-2026-005 waiting on the submitter (due 3 days ago, not counted overdue).
      expect(by('reviewer')).toMatchObject({ openCount: 2, dueSoon: 1, overdue: 0, medianTurnaroundDays: 16 });
      expect(by('reviewer').open.map((o) => o.reference).sort()).toEqual(['HV-2026-004', 'HV-2026-005']);
      // HV-2026-001: assigned 54 days ago, decided 38 days ago.
      expect(by('reviewer').completed).toEqual([expect.objectContaining({ reference: 'HV-2026-001', days: 16 })]);
      // reviewer2: HV-2026-002 due in 4 days, outside the default 3-day window.
      expect(by('reviewer2')).toMatchObject({ openCount: 1, dueSoon: 0, overdue: 0, medianTurnaroundDays: null, completed: [] });
      expect(by('reviewer-emeritus')).toMatchObject({ openCount: 0, expertise: ['one-sample', 'paired', 'regression'] });
      expect(by('reviewer').department).toBe('Office of Institutional Effectiveness');
    });

    it('is for the head only', async () => {
      for (const who of ['reviewer', 'submitter', 'admin']) expect((await (await h.as(who)).get('/api/workload')).status).toBe(403);
      expect((await h.client().get('/api/workload')).status).toBe(401);
    });
  });

  describe('candidates', () => {
    it('suggests the least-loaded reviewer with matching expertise and flags conflicts', async () => {
      const res = await (await h.as('head')).get(`/api/requests/${ids['HV-2026-003']}/assignment/candidates`);
      expect(res.status).toBe(200);
      const list = res.body as AssignmentCandidate[];
      const by = (email: string) => list.find((c) => c.reviewer.email === email)!;
      // HV-2026-003 is a between-subjects ANOVA: only Tomasz (2 open) declares it; Sam declares it too but works in the submitter's department.
      expect(by(emailOf('reviewer'))).toMatchObject({ expertiseMatch: true, openCount: 2, conflict: null, suggested: true });
      expect(by(emailOf('reviewer2'))).toMatchObject({ expertiseMatch: false, openCount: 1, conflict: null, suggested: false });
      expect(by(emailOf('reviewer-emeritus'))).toMatchObject({ expertiseMatch: false, openCount: 0, suggested: false });
      expect(by('sam.okonkwo@demo.test').conflict).toMatch(/submitter's department \(Student Success and Advising\)/);
      expect(list.filter((c) => c.suggested)).toHaveLength(1);
      expect(list.at(-1)!.conflict).not.toBeNull();
    });

    it('falls back to the lowest load when no reviewer declares the design', async () => {
      await ReviewRequest.update({ designKind: 'one-sample' }, { where: { id: ids['HV-2026-003'] } });
      const emeritusExpertise = (await User.findOne({ where: { email: emailOf('reviewer-emeritus') }, rejectOnEmpty: true }));
      await emeritusExpertise.update({ expertise: [] });
      const list = (await (await h.as('head')).get(`/api/requests/${ids['HV-2026-003']}/assignment/candidates`)).body as AssignmentCandidate[];
      expect(list.find((c) => c.suggested)?.reviewer.email).toBe(emailOf('reviewer-emeritus'));
      await ReviewRequest.update({ designKind: 'between-anova' }, { where: { id: ids['HV-2026-003'] } });
      await emeritusExpertise.update({ expertise: ['one-sample', 'paired', 'regression'] });
    });

    it('is hidden from people who cannot see the request and refused to other roles', async () => {
      expect((await (await h.as('reviewer')).get(`/api/requests/${ids['HV-2026-003']}/assignment/candidates`)).status).toBe(404);
      expect((await (await h.as('submitter')).get(`/api/requests/${ids['HV-2026-003']}/assignment/candidates`)).status).toBe(403);
      expect((await (await h.as('head')).get('/api/requests/not-a-uuid/assignment/candidates')).status).toBe(404);
    });
  });

  describe('assigning', () => {
    it('refuses a reviewer from the submitter\'s department, naming the reason', async () => {
      const d = await detail(ids['HV-2026-003']!);
      const res = await (await h.as('head')).send('put', `/api/requests/${ids['HV-2026-003']}/assignment`, { reviewerId: ssaReviewerId, version: d.version });
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('conflict-of-interest');
      expect(res.body.error.message).toMatch(/Sam Okonkwo works in the submitter's department \(Student Success and Advising\)/);
      expect((await detail(ids['HV-2026-003']!)).state).toBe('filed');
      expect(await Assignment.count({ where: { requestId: ids['HV-2026-003'] } })).toBe(0);
    });

    it('refuses the submitter as reviewer of their own request', async () => {
      const d = await detail(morganRequestId);
      const res = await (await h.as('head')).send('put', `/api/requests/${morganRequestId}/assignment`, { reviewerId: morganId, version: d.version });
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('conflict-of-interest');
      expect(res.body.error.message).toMatch(/Morgan Felde filed this request/);
    });

    it('rejects bad input with the field named', async () => {
      const d = await detail(ids['HV-2026-003']!);
      const head = await h.as('head');
      const url = `/api/requests/${ids['HV-2026-003']}/assignment`;
      const noVersion = await head.send('put', url, { reviewerId: await h.userId('reviewer') });
      expect(noVersion.status).toBe(400);
      expect(noVersion.body.error.fields.version).toMatch(/version/);
      const notReviewer = await head.send('put', url, { reviewerId: await h.userId('admin'), version: d.version });
      expect(notReviewer.status).toBe(400);
      expect(notReviewer.body.error.fields.reviewerId).toBeTruthy();
      const badDate = await head.send('put', url, { reviewerId: await h.userId('reviewer'), dueAt: '2026-02-30', version: d.version });
      expect(badDate.status).toBe(400);
      expect(badDate.body.error.fields.dueAt).toMatch(/not a real date/);
      const past = await head.send('put', url, { reviewerId: await h.userId('reviewer'), dueAt: '2020-01-01', version: d.version });
      expect(past.status).toBe(400);
      expect(past.body.error.fields.dueAt).toMatch(/today/);
      expect((await head.send('put', url, { reviewerId: await h.userId('reviewer'), version: d.version, extra: 1 })).status).toBe(400);
    });

    it('assigns: state assigned, due date from the service level, in-app notice and e-mail with the link', async () => {
      const d = await detail(ids['HV-2026-003']!);
      const res = await (await h.as('head')).send('put', `/api/requests/${ids['HV-2026-003']}/assignment`, { reviewerId: await h.userId('reviewer2'), version: d.version, note: 'Check the <unbalanced> cells.' });
      expect(res.status).toBe(200);
      const after = res.body as RequestDetail;
      expect(after.state).toBe('assigned');
      expect(after.reviewer?.email).toBe(emailOf('reviewer2'));
      expect(after.dueAt).toBe(addDays(isoDay(new Date()), 15));
      expect(after.version).toBeGreaterThan(d.version);

      const notes = (await (await h.as('reviewer2')).get('/api/notifications?unread=true')).body as NotificationPage;
      expect(notes.items.find((n) => n.kind === 'request.assigned' && n.requestId === ids['HV-2026-003'])).toMatchObject({ link: `/requests/${ids['HV-2026-003']}` });

      const mail = await waitForMail((m) => m.to.includes(emailOf('reviewer2')) && m.subject.includes('HV-2026-003'));
      expect(mail.subject).toBe('Assigned to you: HV-2026-003');
      expect(mail.text).toContain(`${PUBLIC}/requests/${ids['HV-2026-003']}`);
      expect(mail.text).toContain(DEMO_OFFICE_NAME);
      expect(mail.text).toContain(after.dueAt!);
      expect(mail.text).toContain('Check the <unbalanced> cells.');
      expect(mail.html).toContain(`href="${PUBLIC}/requests/${ids['HV-2026-003']}"`);
      expect(mail.html).toContain('Check the &lt;unbalanced&gt; cells.');
      expect(mail.to).toEqual([emailOf('reviewer2')]);
    });

    it('refuses a stale version', async () => {
      const d = await detail(ids['HV-2026-003']!);
      const res = await (await h.as('head')).send('put', `/api/requests/${ids['HV-2026-003']}/assignment`, { reviewerId: await h.userId('reviewer'), version: d.version - 1 });
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('conflict');
      expect((await detail(ids['HV-2026-003']!)).reviewer?.email).toBe(emailOf('reviewer2'));
    });

    it('escapes the request title in the HTML mail', async () => {
      const d = await detail(morganRequestId);
      const res = await (await h.as('head')).send('put', `/api/requests/${morganRequestId}/assignment`, { reviewerId: await h.userId('reviewer-emeritus'), version: d.version });
      expect(res.status).toBe(200);
      const mail = await waitForMail((m) => m.subject === 'Assigned to you: HV-2026-090');
      expect(mail.to).toEqual([emailOf('reviewer-emeritus')]);
      expect(mail.html).toContain('Placement &lt;scores&gt; &amp; retention');
      expect(mail.html).not.toContain('<scores>');
    });
  });

  describe('declining', () => {
    it('asks for a note when declining for a conflict, and only the assigned reviewer may decline', async () => {
      const url = `/api/requests/${ids['HV-2026-003']}/assignment/decline`;
      const noNote = await (await h.as('reviewer2')).send('post', url, { reason: 'conflict', note: ' ' });
      expect(noNote.status).toBe(400);
      expect(noNote.body.error.fields.note).toMatch(/conflict/);
      expect((await (await h.as('reviewer')).send('post', url, { reason: 'capacity', note: '' })).status).toBe(404);
      expect((await (await h.as('head')).send('post', url, { reason: 'capacity', note: '' })).status).toBe(403);
    });

    it('declining with a conflict sends the request back to filed, e-mails the head and bars the reviewer', async () => {
      const res = await (await h.as('reviewer2')).send('post', `/api/requests/${ids['HV-2026-003']}/assignment/decline`, { reason: 'conflict', note: 'I advised two of the course sections.' });
      expect(res.status).toBe(204);
      const d = await detail(ids['HV-2026-003']!);
      expect(d.state).toBe('filed');
      expect(d.reviewer).toBeNull();
      const mail = await waitForMail((m) => m.to.includes(emailOf('head')) && m.subject === 'Assignment declined: HV-2026-003');
      expect(mail.text).toContain('Imani Castellanos declined');
      expect(mail.text).toContain('conflict of interest');
      expect(mail.text).toContain('I advised two of the course sections.');
      // The declining reviewer no longer sees the request.
      expect((await (await h.as('reviewer2')).get(`/api/requests/${ids['HV-2026-003']}`)).status).toBe(404);
      const again = await (await h.as('head')).send('put', `/api/requests/${ids['HV-2026-003']}/assignment`, { reviewerId: await h.userId('reviewer2'), version: d.version });
      expect(again.status).toBe(409);
      expect(again.body.error.message).toMatch(/declined this request earlier/);
      const list = (await (await h.as('head')).get(`/api/requests/${ids['HV-2026-003']}/assignment/candidates`)).body as AssignmentCandidate[];
      expect(list.find((c) => c.reviewer.email === emailOf('reviewer2'))?.conflict).toMatch(/declined/);
    });
  });

  describe('reassigning', () => {
    it('moves an assigned request to another reviewer and retires the first assignment', async () => {
      const head = await h.as('head');
      const url = `/api/requests/${ids['HV-2026-003']}/assignment`;
      let d = await detail(ids['HV-2026-003']!);
      expect((await head.send('put', url, { reviewerId: await h.userId('reviewer'), dueAt: addDays(isoDay(new Date()), 10), version: d.version })).status).toBe(200);
      d = await detail(ids['HV-2026-003']!);
      expect(d).toMatchObject({ state: 'assigned', dueAt: addDays(isoDay(new Date()), 10) });
      const res = await head.send('put', url, { reviewerId: await h.userId('reviewer-emeritus'), version: d.version });
      expect(res.status).toBe(200);
      expect(res.body).toMatchObject({ state: 'assigned', reviewer: { email: emailOf('reviewer-emeritus') } });
      expect(res.body.version).toBeGreaterThan(d.version);
      const rows = await Assignment.findAll({ where: { requestId: ids['HV-2026-003'] }, order: [['createdAt', 'ASC']] });
      expect(rows.map((a) => [a.active, a.declined, a.declineReason])).toEqual([[false, true, 'conflict'], [false, false, null], [true, false, null]]);
      expect((await (await h.as('reviewer')).get(`/api/requests/${ids['HV-2026-003']}`)).status).toBe(404);
      await waitForMail((m) => m.to.includes(emailOf('reviewer-emeritus')) && m.subject === 'Assigned to you: HV-2026-003');
    });

    it('keeps a request in review when it changes hands', async () => {
      const d = await detail(ids['HV-2026-004']!);
      expect(d.state).toBe('in-review');
      const res = await (await h.as('head')).send('put', `/api/requests/${ids['HV-2026-004']}/assignment`, { reviewerId: await h.userId('reviewer-emeritus'), version: d.version });
      expect(res.status).toBe(200);
      expect(res.body).toMatchObject({ state: 'in-review', reviewer: { email: emailOf('reviewer-emeritus') } });
      expect(res.body.version).toBe(d.version + 1);
    });

    it('refuses requests that are not waiting for or under review', async () => {
      const d = await detail(ids['HV-2026-001']!);
      const res = await (await h.as('head')).send('put', `/api/requests/${ids['HV-2026-001']}/assignment`, { reviewerId: await h.userId('reviewer2'), version: d.version });
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('invalid-state');
    });
  });

  describe('due-soon reminders', () => {
    it('reminds the assigned reviewer once, within the office window', async () => {
      const a002 = await Assignment.findOne({ where: { requestId: ids['HV-2026-002'], active: true }, rejectOnEmpty: true });
      const a004 = await Assignment.findOne({ where: { requestId: ids['HV-2026-004'], active: true }, rejectOnEmpty: true });
      await a004.update({ dueAt: addDays(isoDay(new Date()), 1) });
      const first = await sendDueSoonReminders();
      expect(first).toContain(a004.id);
      expect(first).not.toContain(a002.id); // due in 4 days, window is 3
      const mail = await waitForMail((m) => m.subject === 'Review due soon: HV-2026-004');
      expect(mail.to).toEqual([emailOf('reviewer-emeritus')]);
      expect(mail.text).toContain(a004.dueAt!);
      expect(await sendDueSoonReminders()).toEqual([]);
      expect(mailbox().filter((m) => m.subject === 'Review due soon: HV-2026-004')).toHaveLength(1);
      // Four days ahead, HV-2026-002 enters the window; HV-2026-004 is not reminded again.
      const later = await sendDueSoonReminders(new Date(Date.now() + 2 * 86_400_000));
      expect(later).toEqual([a002.id]);
      expect((await waitForMail((m) => m.subject === 'Review due soon: HV-2026-002')).to).toEqual([emailOf('reviewer2')]);
    });
  });

  describe('office settings', () => {
    it('can be read by every signed-in person (the filing form takes its default alpha from them)', async () => {
      const res = await (await h.as('reviewer')).get('/api/office/settings');
      expect(res.status).toBe(200);
      expect(res.body).toMatchObject({ name: DEMO_OFFICE_NAME, serviceLevelDays: 15, defaultAlpha: 0.05, countersignRequired: false, dueSoonDays: 3 });
      expect(res.body.letterhead).toMatchObject({ institution: 'Harrow Vale Community College', unit: 'Office of Institutional Effectiveness', email: 'oie@demo.test' });
      expect((await (await h.as('admin')).get('/api/office/settings')).status).toBe(200);
      expect((await (await h.as('submitter')).get('/api/office/settings')).body.defaultAlpha).toBe(0.05);
      expect((await h.client().get('/api/office/settings')).status).toBe(401);
    });

    it('only the head may change them; bad values are refused naming the field and nothing is saved', async () => {
      const s = (await (await h.as('head')).get('/api/office/settings')).body as OfficeSettings;
      expect((await (await h.as('reviewer')).send('put', '/api/office/settings', s)).status).toBe(403);
      const zero = await (await h.as('head')).send('put', '/api/office/settings', { ...s, serviceLevelDays: 0 });
      expect(zero.status).toBe(400);
      expect(zero.body.error.fields.serviceLevelDays).toMatch(/serviceLevelDays must be at least 1/);
      const bad = await (await h.as('head')).send('put', '/api/office/settings', { ...s, defaultAlpha: 0.7, letterhead: { ...s.letterhead, email: 'nope', website: 'ftp://x' } });
      expect(bad.status).toBe(400);
      expect(Object.keys(bad.body.error.fields).sort()).toEqual(['defaultAlpha', 'letterhead.email', 'letterhead.website']);
      expect(((await (await h.as('head')).get('/api/office/settings')).body as OfficeSettings).serviceLevelDays).toBe(15);
    });

    it('saves with optimistic locking and the new service level sets the default due date', async () => {
      const head = await h.as('head');
      const s = (await head.get('/api/office/settings')).body as OfficeSettings;
      const next = { ...s, serviceLevelDays: 10, dueSoonDays: 5, letterhead: { ...s.letterhead, addressLines: ['1 Orchard Row', 'Harrow Vale'], website: 'https://oie.demo.test' } };
      const res = await head.send('put', '/api/office/settings', next);
      expect(res.status).toBe(200);
      expect(res.body).toMatchObject({ serviceLevelDays: 10, dueSoonDays: 5, version: s.version + 1, letterhead: { addressLines: ['1 Orchard Row', 'Harrow Vale'], website: 'https://oie.demo.test' } });
      expect((await head.send('put', '/api/office/settings', next)).status).toBe(409);
      const w = (await head.get('/api/workload')).body as Workload;
      expect(w.serviceLevelDays).toBe(10);
      // Morgan's request: reassign without a due date → today + 10.
      const d = await detail(morganRequestId);
      const a = await head.send('put', `/api/requests/${morganRequestId}/assignment`, { reviewerId: await h.userId('reviewer'), version: d.version });
      expect(a.body.dueAt).toBe(addDays(isoDay(new Date()), 10));
    });
  });

  describe('declared expertise', () => {
    it('lets a reviewer declare methods expertise, used by the suggestions', async () => {
      const res = await (await h.as('reviewer2')).send('patch', '/api/me/expertise', { expertise: ['Regression', 'regression', 'repeated measures'] });
      expect(res.status).toBe(200);
      expect(res.body.expertise).toEqual(['Regression', 'repeated measures']);
      expect((await (await h.as('reviewer2')).get('/api/me/expertise')).body).toEqual({ expertise: ['Regression', 'repeated measures'] });
      expect((await (await h.as('head')).get('/api/me/expertise')).status).toBe(403);
      const list = (await (await h.as('head')).get(`/api/requests/${morganRequestId}/assignment/candidates`)).body as AssignmentCandidate[];
      expect(list.find((c) => c.reviewer.email === emailOf('reviewer2'))?.expertiseMatch).toBe(true);
      expect((await (await h.as('submitter')).send('patch', '/api/me/expertise', { expertise: [] })).status).toBe(403);
      const bad = await (await h.as('reviewer2')).send('patch', '/api/me/expertise', { expertise: 'regression' });
      expect(bad.status).toBe(400);
      expect(bad.body.error.fields.expertise).toMatch(/list/);
    });
  });

  describe('outbox', () => {
    it('lists caught mail newest first for admins only, and exists only with the development mail server', async () => {
      const res = await (await h.as('admin')).get('/api/admin/outbox');
      expect(res.status).toBe(200);
      const list = res.body as OutboxMail[];
      expect(list.length).toBe(mailbox().length);
      expect(list[0]!.receivedAt >= list.at(-1)!.receivedAt).toBe(true);
      expect(list.some((m) => m.subject === 'Assigned to you: HV-2026-003' && m.html)).toBe(true);
      expect((await (await h.as('head')).get('/api/admin/outbox')).status).toBe(403);
      const dir = process.env['MAIL_DIR'];
      delete process.env['MAIL_DIR'];
      try {
        expect((await (await h.as('admin')).get('/api/admin/outbox')).status).toBe(404);
      } finally {
        process.env['MAIL_DIR'] = dir;
      }
    });
  });

  describe('every event reaches the right person', () => {
    // HV-2026-002: filed by Owen Tarrant (analyst-writing), assigned to Imani Castellanos (reviewer2).
    const owen = emailOf('analyst-writing');
    const imani = emailOf('reviewer2');
    const head = emailOf('head');
    const cases: { event: NotifyEvent; actor?: string; extra?: Record<string, string>; to: string[] }[] = [
      { event: 'request.filed', actor: 'analyst-writing', to: [head] },
      { event: 'request.assigned', actor: 'head', to: [imani] },
      { event: 'assignment.declined', actor: 'reviewer2', extra: { reason: 'capacity' }, to: [head] },
      { event: 'request.revision-requested', actor: 'reviewer2', extra: { changes: '- report the effect size' }, to: [owen] },
      { event: 'request.resubmitted', actor: 'analyst-writing', to: [imani] },
      { event: 'request.decided', actor: 'reviewer2', extra: { decision: 'endorse' }, to: [owen] },
      { event: 'request.due-soon', to: [imani] },
      { event: 'letter.ready', actor: 'head', to: [owen, imani] },
      { event: 'letter.countersign-needed', actor: 'reviewer2', to: [head] },
      { event: 'comment.added', actor: 'analyst-writing', to: [imani] },
      { event: 'comment.added', actor: 'reviewer2', to: [owen] },
      { event: 'comment.added', actor: 'reviewer2', extra: { internal: 'true' }, to: [head] },
    ];
    it('covers every event', () => {
      expect(new Set(cases.map((c) => c.event))).toEqual(new Set(NOTIFY_EVENTS));
    });
    it.each(cases.map((c) => [`${c.event}${c.extra?.['internal'] ? ' (internal)' : ''} by ${c.actor ?? 'the scheduler'}`, c]))('%s', async (_name, c) => {
      const before = mailbox().length;
      await notifyEvent(c.event, ids['HV-2026-002']!, { actorId: c.actor ? await h.userId(c.actor) : undefined, extra: c.extra });
      const sent = mailbox().slice(before);
      expect(sent).toHaveLength(1);
      expect([...sent[0]!.to].sort()).toEqual([...c.to].sort());
      expect(sent[0]!.subject).toContain('HV-2026-002');
      expect(sent[0]!.text).toContain(`${PUBLIC}/requests/${ids['HV-2026-002']}`);
    });
    it('never tells the actor about their own act', async () => {
      const before = mailbox().length;
      await notifyEvent('request.assigned', ids['HV-2026-002']!, { actorId: await h.userId('reviewer2') });
      expect(mailbox().length).toBe(before);
    });
    it('never throws, even for an unknown request', async () => {
      await expect(notifyEvent('request.filed', '00000000-0000-4000-8000-000000000000')).resolves.toBeUndefined();
    });
  });
});
