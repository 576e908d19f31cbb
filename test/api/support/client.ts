/**
 * A supertest agent that keeps cookies and, like Angular's HttpClient, echoes the
 * XSRF-TOKEN cookie in the X-XSRF-TOKEN header of every state-changing request.
 */
import type { Express } from 'express';
import request, { type Response } from 'supertest';

type Method = 'post' | 'put' | 'patch' | 'delete';

/** One browser-like visitor of the app. */
export class ApiClient {
  readonly agent: ReturnType<typeof request.agent>;
  /** The last XSRF-TOKEN the server sent. */
  token: string | null = null;

  constructor(readonly app: Express) {
    this.agent = request.agent(app);
  }

  /** Remembers a new or cleared XSRF-TOKEN from a response. */
  capture(res: Response): Response {
    const raw = res.headers['set-cookie'] as unknown;
    const cookies: string[] = Array.isArray(raw) ? raw : typeof raw === 'string' ? [raw] : [];
    for (const c of cookies) {
      const m = /^XSRF-TOKEN=([^;]*)/.exec(c);
      if (m) this.token = m[1] ? decodeURIComponent(m[1]) : null;
    }
    return res;
  }

  /** GET (also picks up the CSRF cookie). */
  async get(url: string): Promise<Response> {
    return this.capture(await this.agent.get(url));
  }

  /** A state-changing request with the CSRF header (fetched first if needed); `csrf: false` leaves it out. */
  async send(method: Method, url: string, body?: unknown, opts: { csrf?: boolean } = {}): Promise<Response> {
    if (opts.csrf !== false && !this.token) await this.get('/api/auth/csrf');
    let req = this.agent[method](url);
    if (opts.csrf !== false && this.token) req = req.set('X-XSRF-TOKEN', this.token);
    return this.capture(await (body === undefined ? req : req.send(body as object)));
  }

  /** Signs in with e-mail and password. */
  async login(email: string, password: string): Promise<Response> {
    return this.send('post', '/api/auth/login', { email, password });
  }

  /**
   * Signs in through the fake SAML provider like a browser: follow the redirect to the
   * IdP, pick the person, post the signed response back. Returns the callback's response.
   */
  async samlLogin(personKey: string, relayState?: string): Promise<Response> {
    const start = await this.get(`/api/auth/saml/login${relayState ? `?RelayState=${encodeURIComponent(relayState)}` : ''}`);
    if (start.status !== 302) throw new Error(`SAML login did not redirect (status ${start.status})`);
    const idp = new URL(String(start.headers['location']));
    const picker = await this.get(idp.pathname + idp.search);
    const link = new RegExp(`data-person="${personKey}" href="([^"]+)"`).exec(picker.text);
    if (!link?.[1]) throw new Error(`person ${personKey} not offered by the fake IdP`);
    const posted = await this.get(link[1].replace(/&amp;/g, '&'));
    const form = ApiClient.samlForm(posted.text);
    return this.postSamlResponse(form.SAMLResponse, form.RelayState);
  }

  /** Posts a SAMLResponse to the callback as the IdP's auto-submitted form would. */
  async postSamlResponse(samlResponse: string, relayState = ''): Promise<Response> {
    return this.capture(await this.agent.post('/api/auth/saml/callback').type('form').send({ SAMLResponse: samlResponse, RelayState: relayState }));
  }

  /** Reads the hidden fields of the IdP's auto-POST page. */
  static samlForm(html: string): { SAMLResponse: string; RelayState: string } {
    const field = (name: string) => new RegExp(`name="${name}" value="([^"]*)"`).exec(html)?.[1] ?? '';
    const unescape = (s: string) => s.replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&amp;/g, '&');
    return { SAMLResponse: unescape(field('SAMLResponse')), RelayState: unescape(field('RelayState')) };
  }
}
