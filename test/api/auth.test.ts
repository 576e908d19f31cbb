/** Sign-in and sign-out: local accounts, the fake SAML provider, rate limiting and CSRF. */
import { describe, expect, it } from 'vitest';
import { AuditLog, User, UserRole } from '../../server/models/index';
import { DEMO_PEOPLE } from '../../server/db/demo-people';
import { ApiClient } from './support/client';
import { emailOf, TEST_PASSWORD, useApiHarness } from './support/harness';

const FIVE = ['submitter', 'reviewer', 'reviewer2', 'head', 'admin'] as const;
const rolesOf = (key: string) => DEMO_PEOPLE.find((p) => p.key === key)!.roles;

describe('local sign-in', () => {
  const h = useApiHarness();

  it.each(FIVE)('signs in %s with the demo password and reports the roles', async (key) => {
    const c = h.client();
    const res = await c.login(emailOf(key), TEST_PASSWORD);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ email: emailOf(key), roles: rolesOf(key) });
    expect(res.body.id).toMatch(/^[0-9a-f-]{36}$/);
    const me = await c.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.email).toBe(emailOf(key));
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/assayer\.sid=[^;]+;.*HttpOnly/i);
  });

  it('issues a new session id at sign-in (no session fixation)', async () => {
    const c = h.client();
    const before = await c.get('/api/auth/csrf');
    const sidBefore = /assayer\.sid=([^;]+)/.exec(String(before.headers['set-cookie']))?.[1];
    const res = await c.login(emailOf('submitter'), TEST_PASSWORD);
    const sidAfter = /assayer\.sid=([^;]+)/.exec(String(res.headers['set-cookie']))?.[1];
    expect(sidBefore).toBeTruthy();
    expect(sidAfter).toBeTruthy();
    expect(sidAfter).not.toBe(sidBefore);
  });

  it('refuses a wrong password with 401, the same message as an unknown account, and audits both', async () => {
    const c = h.client();
    const wrong = await c.login(emailOf('head'), 'not-the-password');
    const unknown = await c.login('nobody@demo.test', 'whatever-it-is');
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error.code).toBe('bad-credentials');
    expect(wrong.body.error.message).toBe(unknown.body.error.message);
    expect((await c.get('/api/auth/me')).status).toBe(401);
    const failures = await AuditLog.findAll({ where: { action: 'auth.login-failed' } });
    const reasons = failures.map((f) => f.details['reason']);
    expect(reasons).toContain('wrong-password');
    expect(reasons).toContain('unknown-account');
  });

  it('refuses a deactivated account', async () => {
    await h.sequelize.query("UPDATE users SET active = 0 WHERE email = 'priya.lindqvist@demo.test'");
    const res = await h.client().login('priya.lindqvist@demo.test', TEST_PASSWORD);
    expect(res.status).toBe(401);
    await h.sequelize.query("UPDATE users SET active = 1 WHERE email = 'priya.lindqvist@demo.test'");
  });

  it('validates the login body and names the field', async () => {
    const res = await h.client().send('post', '/api/auth/login', { email: 'not-an-address' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation');
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['email', 'password']));
  });

  it('rate-limits failed attempts per address and account (429), while other accounts still sign in', async () => {
    const app = h.appWith({ LOGIN_RATE_LIMIT: '3' });
    const c = new ApiClient(app);
    const statuses: number[] = [];
    for (let i = 0; i < 5; i++) statuses.push((await c.login(emailOf('reviewer'), `wrong-${i}`)).status);
    expect(statuses).toEqual([401, 401, 401, 429, 429]);
    const blocked = await c.login(emailOf('reviewer'), TEST_PASSWORD);
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('rate-limited');
    expect((await new ApiClient(app).login(emailOf('head'), TEST_PASSWORD)).status).toBe(200);
  });

  it('signs out: the session ends, a new CSRF token is issued at once, and it is audited', async () => {
    const c = await h.as('reviewer2');
    const oldToken = c.token;
    const out = await c.send('post', '/api/auth/logout');
    expect(out.status).toBe(204);
    expect(c.token).toBeTruthy();
    expect(c.token).not.toBe(oldToken);
    expect((await c.agent.get('/api/auth/me')).status).toBe(401);
    // The old token no longer works; the new one lets the person sign in again without another GET.
    expect((await c.agent.post('/api/auth/login').set('X-XSRF-TOKEN', oldToken!).send({ email: emailOf('reviewer2'), password: TEST_PASSWORD })).status).toBe(403);
    expect((await c.login(emailOf('reviewer2'), TEST_PASSWORD)).status).toBe(200);
    const uid = await h.userId('reviewer2');
    expect(await AuditLog.count({ where: { action: 'auth.logout', actorId: uid } })).toBe(1);
    expect(await AuditLog.count({ where: { action: 'auth.login', actorId: uid } })).toBeGreaterThanOrEqual(2);
  });

  it('rejects state-changing requests without the X-XSRF-TOKEN header or with a wrong one (login included)', async () => {
    const anon = h.client();
    await anon.get('/api/auth/csrf');
    const noHeader = await anon.send('post', '/api/auth/login', { email: emailOf('admin'), password: TEST_PASSWORD }, { csrf: false });
    expect(noHeader.status).toBe(403);
    expect(noHeader.body.error.code).toBe('csrf');

    const c = await h.as('submitter');
    const noHeader2 = await c.send('post', '/api/requests', { title: 'Sneaky' }, { csrf: false });
    expect(noHeader2.status).toBe(403);
    const wrong = await c.agent.post('/api/requests').set('X-XSRF-TOKEN', 'forged').send({ title: 'Sneaky' });
    expect(wrong.status).toBe(403);
    // A token from another visitor's session does not work either: it is bound to the session.
    const other = h.client();
    await other.get('/api/auth/csrf');
    const crossed = await c.agent.post('/api/requests').set('X-XSRF-TOKEN', other.token!).send({ title: 'Sneaky' });
    expect(crossed.status).toBe(403);
    expect((await c.send('post', '/api/requests', { title: 'Allowed' })).status).toBe(201);
  });

  it('sets the XSRF-TOKEN cookie readable by scripts (not HttpOnly) and SameSite=Strict', async () => {
    const res = await h.client().get('/api/auth/csrf');
    const cookie = (res.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith('XSRF-TOKEN='))!;
    expect(cookie).toBeTruthy();
    expect(cookie).not.toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Strict/i);
  });
});

describe('SAML sign-in through the fake identity provider', () => {
  const h = useApiHarness();

  it.each(FIVE)('signs in %s and maps the asserted groups to the same roles as the local account', async (key) => {
    const c = h.client();
    const res = await c.samlLogin(key);
    expect(res.status).toBe(303);
    expect(res.headers['location']).toBe('/');
    const me = await c.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({ email: emailOf(key), roles: rolesOf(key) });
    const u = await User.findOne({ where: { email: emailOf(key) }, rejectOnEmpty: true });
    expect(u.samlNameId).toBe(emailOf(key));
    const entry = await AuditLog.findOne({ where: { action: 'auth.login', actorId: u.id }, order: [['at', 'DESC']] });
    expect(entry?.details['method']).toBe('saml');
  });

  it('can make changes after SSO sign-in (a CSRF token comes with the new session)', async () => {
    const c = h.client();
    await c.samlLogin('submitter');
    expect((await c.send('post', '/api/requests', { title: 'Filed after SSO' })).status).toBe(201);
  });

  it('creates a new person just in time with roles from the mappings (single-valued attributes)', async () => {
    expect(await User.count({ where: { email: 'lena.okafor-strand@demo.test' } })).toBe(0);
    const c = h.client();
    const res = await c.samlLogin('newcomer', '/requests/mine');
    expect(res.status).toBe(303);
    expect(res.headers['location']).toBe('/requests/mine');
    const me = await c.get('/api/auth/me');
    expect(me.body).toMatchObject({ email: 'lena.okafor-strand@demo.test', name: 'Lena Okafor-Strand', roles: ['submitter'], department: 'Academic Affairs' });
    const u = await User.findOne({ where: { email: 'lena.okafor-strand@demo.test' }, rejectOnEmpty: true });
    expect(u.passwordHash).toBeNull();
    expect((await UserRole.findAll({ where: { userId: u.id } })).map((r) => [r.role, r.source])).toEqual([['submitter', 'sso']]);
    expect(await AuditLog.count({ where: { action: 'user.created', entityId: u.id } })).toBe(1);
  });

  it('refuses a person whom no mapping grants a role, and creates no account', async () => {
    const res = await h.client().samlLogin('visitor');
    expect(res.status).toBe(303);
    expect(res.headers['location']).toBe('/sign-in?sso-error=no-role');
    expect(await User.count({ where: { email: 'visiting.scholar@demo.test' } })).toBe(0);
  });

  it('ignores a RelayState that leads off the site', async () => {
    const res = await h.client().samlLogin('head', '//evil.test/x');
    expect(res.headers['location']).toBe('/');
  });

  it('rejects a replayed response (InResponseTo already used)', async () => {
    const c = h.client();
    const start = await c.get('/api/auth/saml/login');
    const idp = new URL(String(start.headers['location']));
    const picker = await c.get(idp.pathname + idp.search);
    const href = /data-person="head" href="([^"]+)"/.exec(picker.text)![1]!.replace(/&amp;/g, '&');
    const form = ApiClient.samlForm((await c.get(href)).text);
    expect((await c.postSamlResponse(form.SAMLResponse)).status).toBe(303);
    const replay = h.client();
    const again = await replay.postSamlResponse(form.SAMLResponse);
    expect(again.headers['location']).toBe('/sign-in?sso-error=invalid-response');
    expect((await replay.get('/api/auth/me')).status).toBe(401);
  });

  it('rejects a response whose assertion was altered after signing', async () => {
    const c = h.client();
    const start = await c.get('/api/auth/saml/login');
    const idp = new URL(String(start.headers['location']));
    const picker = await c.get(idp.pathname + idp.search);
    const href = /data-person="submitter" href="([^"]+)"/.exec(picker.text)![1]!.replace(/&amp;/g, '&');
    const form = ApiClient.samlForm((await c.get(href)).text);
    const xml = Buffer.from(form.SAMLResponse, 'base64').toString('utf8');
    const forged = xml.replace('<saml:AttributeValue>hv-analysts</saml:AttributeValue>', '<saml:AttributeValue>oie-admins</saml:AttributeValue>');
    expect(forged).not.toBe(xml);
    const res = await c.postSamlResponse(Buffer.from(forged).toString('base64'));
    expect(res.headers['location']).toBe('/sign-in?sso-error=invalid-response');
    expect((await c.get('/api/auth/me')).status).toBe(401);
    expect(await AuditLog.count({ where: { action: 'auth.login-failed' } })).toBeGreaterThanOrEqual(1);
  });

  it('serves SP metadata XML naming our entity id and callback', async () => {
    const res = await h.client().get('/api/auth/saml/metadata');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/xml/);
    const text = res.text || String(res.body);
    expect(text).toContain('EntityDescriptor');
    expect(text).toContain(`entityID="${h.config.samlIssuer}"`);
    expect(text).toContain(`Location="${h.config.publicUrl}/api/auth/saml/callback"`);
  });
});
