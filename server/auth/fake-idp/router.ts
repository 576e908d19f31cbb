/**
 * The development identity provider, mounted at /fake-idp when no real IdP is configured:
 * GET /fake-idp/sso shows the demo people to pick; GET /fake-idp/sso/pick returns a page
 * that auto-POSTs a signed Response to the SP's callback (script from /fake-idp/autopost.js,
 * because the content security policy forbids inline scripts).
 */
import { Router, type Request, type Response } from 'express';
import { DEMO_PEOPLE, SSO_ONLY_PEOPLE } from '../../db/demo-people';
import { parseAuthnRequest } from './authn-request';
import type { IdpKeys } from './keys';
import { buildSignedResponse } from './response';

/** Settings of the fake IdP. */
export interface FakeIdpOptions { keys: IdpKeys; idpEntityId: string; spEntityId: string; acsUrl: string }

const esc = (s: string) => s.replace(/[<>&"']/g, (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;', '"': '&quot;', "'": '&#39;' })[c]!);

function page(title: string, body: string, script = ''): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${esc(title)}</title>` +
    `<meta name="viewport" content="width=device-width, initial-scale=1"><link rel="stylesheet" href="/fake-idp/idp.css">${script}</head>` +
    `<body><main><p class="tag">Development identity provider — not for production</p>${body}</main></body></html>`;
}

const CSS = `body{font-family:system-ui,sans-serif;background:#f3f1ec;color:#222;margin:0}main{max-width:40rem;margin:3rem auto;padding:2rem;background:#fff;border-radius:12px;box-shadow:0 2px 8px #0002}
.tag{font-size:.8rem;color:#8a4b08;text-transform:uppercase;letter-spacing:.06em}ul{list-style:none;padding:0}li{margin:.5rem 0}
a.person{display:block;padding:.8rem 1rem;border:1px solid #d9d4c7;border-radius:8px;text-decoration:none;color:inherit}a.person:hover{background:#faf6ea}
small{color:#666}`;

function badRequest(res: Response, message: string): void {
  res.status(400).type('html').send(page('Sign-in request not understood', `<h1>Sign-in request not understood</h1><p>${esc(message)}</p>`));
}

/** Creates the fake IdP router. */
export function fakeIdpRouter(opts: FakeIdpOptions): Router {
  const router = Router();
  const people = [...DEMO_PEOPLE, ...SSO_ONLY_PEOPLE];

  router.get('/idp.css', (_req, res) => { res.type('css').send(CSS); });
  router.get('/autopost.js', (_req, res) => { res.type('js').send("document.getElementById('saml-post').submit();"); });

  router.get('/sso', (req: Request, res: Response) => {
    const samlRequest = typeof req.query['SAMLRequest'] === 'string' ? req.query['SAMLRequest'] : '';
    const relay = typeof req.query['RelayState'] === 'string' ? req.query['RelayState'] : '';
    try { parseAuthnRequest(samlRequest); } catch (e) { return badRequest(res, (e as Error).message); }
    const items = people.map((p) => {
      const qs = new URLSearchParams({ person: p.key, SAMLRequest: samlRequest, RelayState: relay }).toString();
      const groups = ([] as string[]).concat(p.sso['isMemberOf'] ?? []).join(', ') || 'no groups';
      return `<li><a class="person" data-person="${esc(p.key)}" href="/fake-idp/sso/pick?${esc(qs)}"><strong>${esc(p.name)}</strong><br><small>${esc(p.email)} · ${esc(groups)}</small></a></li>`;
    });
    res.type('html').send(page('Choose a demo person', `<h1>Sign in as…</h1><p>Pick a demo person of Harrow Vale Community College.</p><ul>${items.join('')}</ul>`));
  });

  router.get('/sso/pick', (req: Request, res: Response) => {
    const samlRequest = typeof req.query['SAMLRequest'] === 'string' ? req.query['SAMLRequest'] : '';
    const relay = typeof req.query['RelayState'] === 'string' ? req.query['RelayState'] : '';
    const person = people.find((p) => p.key === req.query['person']);
    if (!person) return badRequest(res, 'Unknown demo person.');
    let parsed;
    try { parsed = parseAuthnRequest(samlRequest); } catch (e) { return badRequest(res, (e as Error).message); }
    // Always answer our own SP's callback, whatever the request names, so this page cannot post elsewhere.
    const xml = buildSignedResponse({
      idpEntityId: opts.idpEntityId, spEntityId: opts.spEntityId, acsUrl: opts.acsUrl, inResponseTo: parsed.id,
      nameId: person.email, attributes: { mail: person.email, displayName: person.name, ...person.sso },
    }, opts.keys);
    const action = new URL(opts.acsUrl).pathname;
    res.type('html').send(page('Signing in…',
      `<h1>Signing in as ${esc(person.name)}…</h1><form id="saml-post" method="post" action="${esc(action)}">` +
      `<input type="hidden" name="SAMLResponse" value="${esc(Buffer.from(xml).toString('base64'))}">` +
      `<input type="hidden" name="RelayState" value="${esc(relay)}"><noscript><button type="submit">Continue</button></noscript></form>`,
      '<script src="/fake-idp/autopost.js" defer></script>'));
  });
  return router;
}
