/**
 * The API description stays true: every route the routers register (read from server/app.ts
 * and the router files) is documented, every documented route is answered by a router, and
 * docs/openapi.yaml is the text the server serves.
 */
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { openApiSpec } from '../../server/docs/openapi-spec';
import { openApiYamlText } from '../../server/docs/openapi-yaml';
import { useApiHarness } from './support/harness';

const read = (p: string) => fs.readFileSync(path.resolve(p), 'utf8');
const toOpenApi = (p: string) => p.replace(/:(\w+)/g, '{$1}').replace(/\/$/, '');

/** "METHOD /api/path" for every route registered under /api, found by reading the source. */
function registeredRoutes(): Set<string> {
  const app = read('server/app.ts');
  const imports = new Map<string, string>();
  for (const m of app.matchAll(/import \{([^}]+)\} from '\.\/routes\/([\w-]+)';/g)) {
    for (const name of m[1]!.split(',').map((s) => s.trim())) imports.set(name, `server/routes/${m[2]}.ts`);
  }
  const out = new Set<string>();
  for (const m of app.matchAll(/api\.use\('([^']+)', (\w+)\(/g)) {
    const [, mount, fn] = m;
    const file = imports.get(fn!);
    if (!file) throw new Error(`router ${fn} mounted at ${mount} is not imported from server/routes`);
    const src = read(file);
    const start = src.indexOf(`export function ${fn}(`);
    const next = src.indexOf('export function ', start + 1);
    const body = src.slice(start, next === -1 ? undefined : next);
    for (const r of body.matchAll(/\.(get|post|put|patch|delete)\(\s*'(\/[^']*)'/g)) {
      out.add(`${r[1]!.toUpperCase()} ${toOpenApi(`/api${mount}${r[2] === '/' ? '' : r[2]}`)}`);
    }
  }
  return out;
}

function documentedRoutes(): Set<string> {
  const out = new Set<string>();
  for (const [p, item] of Object.entries(openApiSpec()['paths'] as Record<string, Record<string, unknown>>)) {
    for (const m of Object.keys(item)) out.add(`${m.toUpperCase()} ${p}`);
  }
  return out;
}

describe('API description', () => {
  const h = useApiHarness();

  it('documents exactly the routes the routers register', () => {
    const registered = registeredRoutes();
    const documented = documentedRoutes();
    // A sanity floor so a broken source scan cannot pass by finding nothing.
    expect(registered.size).toBeGreaterThan(50);
    expect([...registered].filter((r) => !documented.has(r)).sort()).toEqual([]);
    expect([...documented].filter((r) => !registered.has(r)).sort()).toEqual([]);
  });

  it('is answered by the app for every documented route (never the JSON 404 for unknown routes)', async () => {
    // Signed in (so routers that require sign-in for all their paths still fall through to the
    // JSON 404 when no route matches) and with the CSRF header (so writes reach the routers).
    const admin = await h.as('admin');
    for (const route of documentedRoutes()) {
      if (route === 'POST /api/auth/logout') continue;
      const [method, p] = route.split(' ') as [string, string];
      const url = p.replace(/\{[^}]+\}/g, '00000000-0000-4000-8000-000000000000');
      const res = method === 'GET' ? await admin.get(url) : await admin.send(method.toLowerCase() as 'post', url, {});
      expect(`${route} → ${res.status} ${res.body?.error?.message ?? ''}`).not.toMatch(/No API route/);
    }
  });

  it('keeps docs/openapi.yaml in step with the served text (run npx tsx server/docs/write-openapi.ts)', async () => {
    expect(read('docs/openapi.yaml')).toBe(openApiYamlText());
    const res = await h.client().get('/api/docs/openapi.yaml');
    expect(res.text).toBe(openApiYamlText());
    const spec = openApiSpec();
    expect(spec['openapi']).toBe('3.1.0');
    // Every $ref points at a defined schema.
    const schemas = (spec['components'] as { schemas: Record<string, unknown> }).schemas;
    const refs = [...JSON.stringify(spec).matchAll(/"#\/components\/schemas\/(\w+)"/g)].map((m) => m[1]!);
    expect(refs.filter((r) => !(r in schemas))).toEqual([]);
  });
});
