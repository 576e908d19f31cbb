/** Platform behaviour: health, JSON errors without internals, security headers, optimistic locking, and the audit log. */
import { Router } from 'express';
import { describe, expect, it } from 'vitest';
import { AuditLog, ReviewRequest } from '../../server/models/index';
import { moveRequest } from '../../server/services/request-state';
import { ApiClient } from './support/client';
import { emailOf, useApiHarness } from './support/harness';

describe('platform', () => {
  const h = useApiHarness();

  it('reports health with a live database check', async () => {
    const res = await h.client().get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'ok', database: { status: 'ok' } });
    expect(typeof res.body.database.latencyMs).toBe('number');
    expect(res.body.version).toMatch(/^\d+\.\d+\.\d+/);
    expect(res.headers['set-cookie']).toBeUndefined();
    // The seeded demo office: the sign-in page may list the demo accounts and shows the office's name.
    expect(res.body.demo).toBe(true);
    expect(res.body.office).toEqual({ name: 'Office of Institutional Effectiveness', institution: 'Harrow Vale Community College' });
  });

  it('answers unknown /api paths with a JSON 404', async () => {
    const c = await h.as('head');
    const res = await c.get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/json/);
    expect(res.body).toEqual({ error: { status: 404, code: 'not-found', message: 'No API route GET /no-such-thing.' } });
  });

  it('never sends a stack trace or the error text of an unexpected failure', async () => {
    const boom = Router().get('/', () => { throw new Error('secret internals at /srv/assayer/db.ts:42'); });
    const app = h.appWith({}, { '/boom': boom });
    const res = await new ApiClient(app).get('/api/boom');
    expect(res.status).toBe(500);
    expect(res.body).toEqual({ error: { status: 500, code: 'internal', message: 'Something went wrong on the server. The error was logged.' } });
    expect(res.text).not.toMatch(/secret internals|at .*\.ts|stack/i);
  });

  it('limits JSON bodies to 256 kB (413) and reports malformed JSON (400)', async () => {
    const c = await h.as('submitter');
    const big = await c.send('post', '/api/requests', { title: 'x', purpose: 'y'.repeat(300 * 1024) });
    expect(big.status).toBe(413);
    expect(big.body.error.code).toBe('too-large');
    const bad = await c.agent.post('/api/requests').set('X-XSRF-TOKEN', c.token!).set('Content-Type', 'application/json').send('{"title": ');
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('malformed');
  });

  it('validates bodies and names each bad field', async () => {
    const c = await h.as('submitter');
    const res = await c.send('post', '/api/requests', { title: '', deadline: '2026-13-45', designKind: 'astrology', colour: 'red' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation');
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['colour', 'deadline', 'designKind', 'title']);
    expect(res.body.error.fields.title).toBe('Title is required');
  });

  it('sends security headers: CSP limited to our own origin, no framing, no x-powered-by', async () => {
    const res = await h.client().get('/api/health');
    const csp = String(res.headers['content-security-policy']);
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("script-src 'self'");
    expect(csp).toContain("style-src 'self' 'unsafe-inline'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('marks cookies Secure when PUBLIC_URL is https', async () => {
    const app = h.appWith({ PUBLIC_URL: 'https://assayer.example.test' });
    const res = await new ApiClient(app).get('/api/auth/csrf');
    for (const cookie of res.headers['set-cookie'] as unknown as string[]) expect(cookie).toMatch(/;\s*Secure/i);
  });

  it('creates a draft with the next reference, audited', async () => {
    const c = await h.as('submitter');
    const res = await c.send('post', '/api/requests', { title: 'Retention of evening students', deadline: '2027-02-01' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ state: 'draft', title: 'Retention of evening students', deadline: '2027-02-01', version: 0, department: 'Student Success and Advising' });
    expect(res.body.reference).toMatch(new RegExp(`^HV-${new Date().getUTCFullYear()}-\\d{3}$`));
    const entry = await AuditLog.findOne({ where: { action: 'request.created', entityId: res.body.id } });
    expect(entry?.actorId).toBe(await h.userId('submitter'));
  });

  it('refuses a stale edit with 409 (optimistic locking) and keeps the first edit', async () => {
    const alice = await h.as('submitter');
    const bob = await h.as('submitter');
    const id = await h.requestId('HV-2026-006');
    const { version } = (await alice.get(`/api/requests/${id}`)).body as { version: number };
    const first = await alice.send('patch', `/api/requests/${id}`, { purpose: 'First edit wins.', version });
    expect(first.status).toBe(200);
    expect(first.body.version).toBe(version + 1);
    const second = await bob.send('patch', `/api/requests/${id}`, { purpose: 'Second edit is stale.', version });
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe('conflict');
    expect((await ReviewRequest.findByPk(id))!.purpose).toBe('First edit wins.');
    const audited = await AuditLog.findOne({ where: { action: 'request.updated', entityId: id } });
    expect(audited?.details['fields']).toEqual(['purpose']);
  });

  it('applies optimistic locking and audit to role changes', async () => {
    const admin = await h.as('admin');
    const owen = await h.userId('analyst-writing');
    const row = (await admin.get(`/api/admin/users?q=${encodeURIComponent(emailOf('analyst-writing'))}`)).body.items[0];
    expect(row).toMatchObject({ id: owen, roles: ['submitter'], signIn: ['local'], active: true });
    const changed = await admin.send('patch', `/api/admin/users/${owen}`, { roles: ['submitter', 'reviewer'], version: row.version });
    expect(changed.status).toBe(200);
    expect(changed.body.roles).toEqual(['submitter', 'reviewer']);
    const stale = await admin.send('patch', `/api/admin/users/${owen}`, { roles: ['submitter'], version: row.version });
    expect(stale.status).toBe(409);
    const entry = await AuditLog.findOne({ where: { action: 'user.roles-changed', entityId: owen } });
    expect(entry?.details).toMatchObject({ before: ['submitter'], after: ['submitter', 'reviewer'] });
    // The change takes effect on the person's next request.
    const owenClient = await h.as('analyst-writing');
    expect((await owenClient.get('/api/requests?scope=assigned')).status).toBe(200);
  });

  it('keeps an admin from removing their own admin role', async () => {
    const admin = await h.as('admin');
    const self = await h.userId('admin');
    const row = (await admin.get(`/api/admin/users?q=${encodeURIComponent(emailOf('admin'))}`)).body.items[0];
    const res = await admin.send('patch', `/api/admin/users/${self}`, { roles: ['reviewer'], version: row.version });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('self-lockout');
  });

  it('creates local accounts that can sign in, and refuses duplicates', async () => {
    const admin = await h.as('admin');
    const body = { email: 'New.Analyst@Demo.test', name: 'Marisol Quennell', password: 'a-long-enough-password', roles: ['submitter'] };
    const res = await admin.send('post', '/api/admin/users', body);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email: 'new.analyst@demo.test', roles: ['submitter'], signIn: ['local'] });
    expect((await admin.send('post', '/api/admin/users', body)).status).toBe(409);
    expect((await h.client().login('new.analyst@demo.test', 'a-long-enough-password')).status).toBe(200);
    expect((await admin.send('post', '/api/admin/users', { ...body, email: 'short@demo.test', password: 'short' })).body.error.fields.password).toMatch(/12 characters/);
  });

  it('filters, sorts and pages the people list', async () => {
    const admin = await h.as('admin');
    const reviewers = await admin.get('/api/admin/users?role=reviewer&sort=email&dir=asc&pageSize=2');
    expect(reviewers.status).toBe(200);
    expect(reviewers.body.pageSize).toBe(2);
    expect(reviewers.body.items).toHaveLength(2);
    expect(reviewers.body.total).toBeGreaterThanOrEqual(3);
    const emails = (reviewers.body.items as { email: string }[]).map((u) => u.email);
    expect(emails).toEqual([...emails].sort());
    const page1 = await admin.get('/api/admin/users?role=reviewer&sort=email&dir=asc&pageSize=2&page=1');
    expect((page1.body.items as { email: string }[]).map((u) => u.email)).not.toContain(emails[0]);
    expect((await admin.get('/api/admin/users?pageSize=1000')).status).toBe(400);
  });

  it('replaces role mappings (validated, audited)', async () => {
    const admin = await h.as('admin');
    const before = (await admin.get('/api/admin/role-mappings')).body as { attribute: string; value: string; role: string }[];
    expect(before).toHaveLength(4);
    const bad = await admin.send('put', '/api/admin/role-mappings', { mappings: [{ attribute: '', value: 'x', role: 'emperor' }] });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(expect.arrayContaining(['mappings.0.attribute', 'mappings.0.role']));
    const next = [...before.map(({ attribute, value, role }) => ({ attribute, value, role })), { attribute: 'eduPersonAffiliation', value: 'faculty', role: 'submitter' }];
    const ok = await admin.send('put', '/api/admin/role-mappings', { mappings: next });
    expect(ok.status).toBe(200);
    expect(ok.body).toHaveLength(5);
    expect(await AuditLog.count({ where: { action: 'role-mappings.replaced' } })).toBe(1);
  });

  it('lists the caller\'s own notifications only', async () => {
    const reviewer = await h.as('reviewer');
    const res = await reviewer.get('/api/notifications');
    expect(res.status).toBe(200);
    expect(res.body.total).toBeGreaterThan(0);
    expect((res.body.items as { kind: string }[]).every((n) => n.kind === 'request.assigned')).toBe(true);
    const someoneElses = (await (await h.as('head')).get('/api/notifications')).body.items[0].id as string;
    expect((await reviewer.send('post', `/api/notifications/${someoneElses}/read`)).status).toBe(404);
  });

  it('filters the audit log by actor, action, entity and dates, newest first', async () => {
    const admin = await h.as('admin');
    const logins = await admin.get(`/api/audit?action=auth.login&actor=${encodeURIComponent(emailOf('admin'))}`);
    expect(logins.status).toBe(200);
    expect(logins.body.total).toBeGreaterThan(0);
    for (const e of logins.body.items) {
      expect(e.action.startsWith('auth.login')).toBe(true);
      expect(e.actor.email).toBe(emailOf('admin'));
    }
    const ats = (logins.body.items as { at: string }[]).map((e) => e.at);
    expect(ats).toEqual([...ats].sort().reverse());
    const today = new Date().toISOString().slice(0, 10);
    expect((await admin.get(`/api/audit?from=${today}&to=${today}`)).body.total).toBeGreaterThan(0);
    expect((await admin.get('/api/audit?to=2000-01-01')).body.total).toBe(0);
    expect((await admin.get('/api/audit?entity=user')).body.items.every((e: { entityType: string }) => e.entityType === 'user')).toBe(true);
    expect((await admin.get('/api/audit?from=yesterday')).status).toBe(400);
  });

  it('keeps the audit log append-only: no API to change it, the model refuses, the database refuses', async () => {
    const admin = await h.as('admin');
    const entry = (await AuditLog.findOne({ order: [['at', 'ASC']] }))!;
    const original = entry.action;
    for (const method of ['put', 'patch', 'delete'] as const) {
      expect((await admin.send(method, `/api/audit/${entry.id}`, {})).status).toBe(404);
    }
    await expect(entry.update({ action: 'rewritten' })).rejects.toThrow(/append-only/);
    await expect(entry.destroy()).rejects.toThrow(/append-only/);
    await expect(AuditLog.update({ action: 'rewritten' }, { where: {} })).rejects.toThrow(/append-only/);
    await expect(h.sequelize.query(`UPDATE audit_log SET action = 'rewritten' WHERE id = '${entry.id}'`)).rejects.toThrow(/append-only/);
    await expect(h.sequelize.query('DELETE FROM audit_log')).rejects.toThrow(/append-only/);
    expect((await AuditLog.findByPk(entry.id))!.action).toBe(original);
  });

  it('moves requests only along allowed paths, with locking, and audits each move', async () => {
    const head = await h.userId('head');
    const r = (await ReviewRequest.findOne({ where: { reference: 'HV-2026-003' } }))!;
    await expect(moveRequest(r, 'assigned', { actorId: head, version: r.version - 1 })).rejects.toMatchObject({ status: 409, code: 'conflict' });
    await moveRequest(r, 'assigned', { actorId: head, version: r.version, details: { reviewer: 'reviewer2' } });
    expect((await ReviewRequest.findByPk(r.id))!.state).toBe('assigned');
    const entry = await AuditLog.findOne({ where: { action: 'request.assigned', entityId: r.id } });
    expect(entry?.details).toMatchObject({ from: 'filed', to: 'assigned', reviewer: 'reviewer2' });
    const decided = (await ReviewRequest.findOne({ where: { reference: 'HV-2026-001' } }))!;
    await expect(moveRequest(decided, 'filed', { actorId: head })).rejects.toMatchObject({ status: 409, code: 'invalid-state' });
  });
});
