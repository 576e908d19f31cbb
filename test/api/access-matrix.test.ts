/**
 * The access matrix: every route × each role × own and other people's records, generated
 * from one declarative table. Records a caller may not see answer 404 (not 403), so their
 * existence is not revealed; 403 means "visible, but your role may not do this".
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { ReviewRequest, RoleMappingRow, User } from '../../server/models/index';
import type { ApiClient } from './support/client';
import { emailOf, useApiHarness } from './support/harness';

const WHO = ['anon', 'submitter', 'reviewer', 'reviewer2', 'head', 'admin'] as const;
type Who = (typeof WHO)[number];

/** Seeded records by role in the matrix (see server/db/demo-requests.ts). */
const REC = {
  ownDraft: 'HV-2026-006', // submitter's draft
  ownFiled: 'HV-2026-003', // submitter's, filed, not yet assigned
  ownInReview: 'HV-2026-004', // submitter's, assigned to reviewer
  ownDecided: 'HV-2026-001', // submitter's, decided by reviewer
  otherAssigned: 'HV-2026-002', // another submitter's, assigned to reviewer2
  otherRevision: 'HV-2026-005', // another submitter's, revision requested by reviewer
  otherDraft: 'HV-2026-007', // another submitter's draft
} as const;
type Rec = keyof typeof REC;

interface Row {
  route: string;
  method: 'get' | 'post' | 'patch' | 'put';
  path: (ids: Record<Rec, string>) => string;
  body?: (n: number) => Promise<unknown>;
  /** Expected status per caller; a single number means the same for every signed-in caller (anon gets 401). */
  expect: Partial<Record<Who, number>> & { signedIn?: number };
}

const versionOf = async (reference: string) => (await ReviewRequest.findOne({ where: { reference }, rejectOnEmpty: true })).version;
const editRequest = (reference: string) => async (n: number) => ({ title: `Edited in the matrix ${n}`, version: await versionOf(reference) });

const only = (allowed: Who[], ok: number, otherwise: number): Row['expect'] =>
  Object.fromEntries(WHO.map((w) => [w, w === 'anon' ? 401 : allowed.includes(w) ? ok : otherwise]));

const MATRIX: Row[] = [
  { route: 'GET /api/health', method: 'get', path: () => '/api/health', expect: { anon: 200, signedIn: 200 } },
  { route: 'GET /api/auth/me', method: 'get', path: () => '/api/auth/me', expect: { signedIn: 200 } },
  { route: 'GET /api/auth/saml/metadata', method: 'get', path: () => '/api/auth/saml/metadata', expect: { anon: 200, signedIn: 200 } },
  { route: 'GET /api/departments', method: 'get', path: () => '/api/departments', expect: { signedIn: 200 } },
  { route: 'GET /api/notifications', method: 'get', path: () => '/api/notifications', expect: { signedIn: 200 } },
  { route: 'GET /api/requests (default scope)', method: 'get', path: () => '/api/requests', expect: { signedIn: 200 } },
  { route: 'GET /api/requests?scope=mine', method: 'get', path: () => '/api/requests?scope=mine', expect: { signedIn: 200 } },
  { route: 'GET /api/requests?scope=intake', method: 'get', path: () => '/api/requests?scope=intake', expect: only(['head'], 200, 403) },
  { route: 'GET /api/requests?scope=assigned', method: 'get', path: () => '/api/requests?scope=assigned', expect: only(['reviewer', 'reviewer2'], 200, 403) },
  { route: 'GET /api/requests?scope=all', method: 'get', path: () => '/api/requests?scope=all', expect: only(['head', 'admin'], 200, 403) },
  { route: 'POST /api/requests', method: 'post', path: () => '/api/requests', body: async (n) => ({ title: `Matrix draft ${n}` }), expect: only(['submitter'], 201, 403) },

  { route: 'GET /api/requests/:id own draft', method: 'get', path: (i) => `/api/requests/${i.ownDraft}`, expect: only(['submitter'], 200, 404) },
  { route: 'GET /api/requests/:id own filed', method: 'get', path: (i) => `/api/requests/${i.ownFiled}`, expect: only(['submitter', 'head', 'admin'], 200, 404) },
  { route: 'GET /api/requests/:id own in review', method: 'get', path: (i) => `/api/requests/${i.ownInReview}`, expect: only(['submitter', 'reviewer', 'head', 'admin'], 200, 404) },
  { route: 'GET /api/requests/:id own decided', method: 'get', path: (i) => `/api/requests/${i.ownDecided}`, expect: only(['submitter', 'reviewer', 'head', 'admin'], 200, 404) },
  { route: "GET /api/requests/:id other's, assigned to reviewer2", method: 'get', path: (i) => `/api/requests/${i.otherAssigned}`, expect: only(['reviewer2', 'head', 'admin'], 200, 404) },
  { route: "GET /api/requests/:id other's, revision requested", method: 'get', path: (i) => `/api/requests/${i.otherRevision}`, expect: only(['reviewer', 'head', 'admin'], 200, 404) },
  { route: "GET /api/requests/:id other's draft", method: 'get', path: (i) => `/api/requests/${i.otherDraft}`, expect: only([], 200, 404) },
  { route: 'GET /api/requests/:id unknown id', method: 'get', path: () => '/api/requests/00000000-0000-4000-8000-000000000000', expect: only([], 200, 404) },
  { route: 'GET /api/requests/:id malformed id', method: 'get', path: () => '/api/requests/not-an-id', expect: only([], 200, 404) },

  { route: 'PATCH /api/requests/:id own draft', method: 'patch', path: (i) => `/api/requests/${i.ownDraft}`, body: editRequest(REC.ownDraft), expect: only(['submitter'], 200, 404) },
  {
    route: 'PATCH /api/requests/:id own in review', method: 'patch', path: (i) => `/api/requests/${i.ownInReview}`, body: editRequest(REC.ownInReview),
    expect: { anon: 401, submitter: 409, reviewer: 403, reviewer2: 404, head: 403, admin: 403 },
  },
  {
    route: "PATCH /api/requests/:id other's, revision requested", method: 'patch', path: (i) => `/api/requests/${i.otherRevision}`, body: editRequest(REC.otherRevision),
    expect: { anon: 401, submitter: 404, reviewer: 403, reviewer2: 404, head: 403, admin: 403 },
  },
  { route: "PATCH /api/requests/:id other's draft", method: 'patch', path: (i) => `/api/requests/${i.otherDraft}`, body: editRequest(REC.otherDraft), expect: only([], 200, 404) },

  { route: 'GET /api/admin/users', method: 'get', path: () => '/api/admin/users', expect: only(['admin'], 200, 403) },
  {
    route: 'POST /api/admin/users', method: 'post', path: () => '/api/admin/users',
    body: async (n) => ({ email: `matrix-${n}@demo.test`, name: `Matrix Person ${n}`, password: 'long-enough-password', roles: ['submitter'] }),
    expect: only(['admin'], 201, 403),
  },
  {
    route: 'PATCH /api/admin/users/:id', method: 'patch', path: () => '/api/admin/users/:owen',
    body: async (n) => ({ name: `Owen Tarrant ${n}`, version: (await User.findOne({ where: { email: emailOf('analyst-writing') }, rejectOnEmpty: true })).version }),
    expect: only(['admin'], 200, 403),
  },
  { route: 'GET /api/admin/role-mappings', method: 'get', path: () => '/api/admin/role-mappings', expect: only(['admin'], 200, 403) },
  {
    route: 'PUT /api/admin/role-mappings', method: 'put', path: () => '/api/admin/role-mappings',
    body: async () => ({ mappings: (await RoleMappingRow.findAll()).map(({ attribute, value, role }) => ({ attribute, value, role })) }),
    expect: only(['admin'], 200, 403),
  },
  { route: 'GET /api/audit', method: 'get', path: () => '/api/audit', expect: only(['admin'], 200, 403) },
];

const expected = (row: Row, who: Who): number => row.expect[who] ?? (who === 'anon' ? 401 : row.expect.signedIn!);

describe('access matrix', () => {
  const h = useApiHarness();
  const clients = {} as Record<Who, ApiClient>;
  const ids = {} as Record<Rec, string>;
  let owen = '';
  let n = 0;

  beforeAll(async () => {
    clients.anon = h.client();
    for (const w of WHO) if (w !== 'anon') clients[w] = await h.as(w);
    for (const [k, ref] of Object.entries(REC)) ids[k as Rec] = await h.requestId(ref);
    owen = await h.userId('analyst-writing');
  });

  const cases = MATRIX.flatMap((row) => WHO.map((who) => ({ row, who, label: `${row.route} as ${who} → ${expected(row, who)}` })));
  it.each(cases)('$label', async ({ row, who }) => {
    const c = clients[who];
    const url = row.path(ids).replace(':owen', owen);
    const res = row.method === 'get' ? await c.get(url) : await c.send(row.method, url, row.body ? await row.body(++n) : undefined);
    expect(res.status, res.text.slice(0, 300)).toBe(expected(row, who));
    if (res.status >= 400) {
      expect(res.body.error.status).toBe(res.status);
      expect(typeof res.body.error.code).toBe('string');
    }
  });

  it('lists show exactly the requests each role may open', async () => {
    const all = await ReviewRequest.findAll();
    for (const who of WHO.filter((w) => w !== 'anon')) {
      const c = clients[who];
      const listed = new Set<string>();
      for (const scope of ['mine', 'intake', 'assigned', 'all']) {
        const res = await c.get(`/api/requests?scope=${scope}&pageSize=100`);
        if (res.status === 200) for (const item of res.body.items as { id: string }[]) listed.add(item.id);
      }
      const openable = new Set<string>();
      for (const r of all) if ((await c.get(`/api/requests/${r.id}`)).status === 200) openable.add(r.id);
      expect([...listed].sort(), who).toEqual([...openable].sort());
    }
  });

  it('scopes hold what they promise', async () => {
    const refs = async (c: ApiClient, q: string) => ((await c.get(`/api/requests?${q}&pageSize=100`)).body.items as { reference: string }[]).map((i) => i.reference).sort();
    expect(await refs(clients.head, 'scope=intake')).toEqual([REC.ownFiled]);
    expect(await refs(clients.reviewer, 'scope=assigned')).toEqual([REC.ownDecided, REC.ownInReview, REC.otherRevision].sort());
    expect(await refs(clients.reviewer2, 'scope=assigned')).toEqual([REC.otherAssigned]);
    const headAll = await refs(clients.head, 'scope=all');
    expect(headAll).not.toContain(REC.ownDraft);
    expect(headAll).not.toContain(REC.otherDraft);
    expect(headAll).toEqual(await refs(clients.admin, 'scope=all'));
    const mine = await refs(clients.submitter, 'scope=mine');
    expect(mine).toEqual(expect.arrayContaining([REC.ownDraft, REC.ownFiled, REC.ownInReview, REC.ownDecided]));
    expect(mine).not.toContain(REC.otherDraft);
  });

  it('detail tells each caller what they may do', async () => {
    const can = async (who: Who, rec: Rec) => (await clients[who].get(`/api/requests/${ids[rec]}`)).body.can;
    expect(await can('submitter', 'ownDraft')).toMatchObject({ edit: true, assign: false, review: false, decide: false, withdraw: true });
    expect(await can('head', 'ownFiled')).toMatchObject({ edit: false, assign: true });
    expect(await can('reviewer', 'ownInReview')).toMatchObject({ review: true, decide: true, edit: false });
    expect(await can('admin', 'ownInReview')).toEqual({ edit: false, assign: false, review: false, decide: false, withdraw: false });
  });
});
