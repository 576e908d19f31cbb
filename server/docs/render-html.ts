/**
 * A readable HTML page of the OpenAPI description: one section per tag, each operation
 * with its summary, parameters, request body and responses. No scripts, so it works
 * under the app's strict content security policy.
 */

type Json = Record<string, unknown>;
const esc = (s: unknown) => String(s ?? '').replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
const METHODS = ['get', 'post', 'put', 'patch', 'delete'] as const;

function schemaName(s: unknown): string {
  if (!s || typeof s !== 'object') return '';
  const o = s as Json;
  if (typeof o['$ref'] === 'string') {
    const name = (o['$ref'] as string).split('/').pop()!;
    return `<a href="#schema-${esc(name)}">${esc(name)}</a>`;
  }
  if (o['type'] === 'array') return `${schemaName(o['items'])}[]`;
  if (Array.isArray(o['oneOf'])) return (o['oneOf'] as unknown[]).map(schemaName).join(' | ');
  if (Array.isArray(o['allOf'])) return (o['allOf'] as unknown[]).map(schemaName).join(' + ');
  if (Array.isArray(o['enum'])) return (o['enum'] as unknown[]).map((x) => esc(JSON.stringify(x))).join(' | ');
  return esc(Array.isArray(o['type']) ? (o['type'] as string[]).join(' | ') : o['type'] ?? 'object');
}

function content(c: unknown): string {
  if (!c || typeof c !== 'object') return '';
  return Object.entries(c as Json).map(([type, v]) => `<code>${esc(type)}</code> ${schemaName((v as Json)['schema'])}`).join('; ');
}

function operation(method: string, path: string, op: Json): string {
  const params = (op['parameters'] as Json[] | undefined) ?? [];
  const rows = params.map((p) => `<tr><td><code>${esc(p['name'])}</code></td><td>${esc(p['in'])}</td><td>${p['required'] ? 'yes' : 'no'}</td><td>${schemaName(p['schema'])}</td><td>${esc(p['description'])}</td></tr>`).join('');
  const body = op['requestBody'] as Json | undefined;
  const responses = Object.entries((op['responses'] as Json | undefined) ?? {})
    .map(([code, r]) => `<li><strong>${esc(code)}</strong> ${esc((r as Json)['description'])} ${content((r as Json)['content'])}</li>`).join('');
  return `<article class="op" id="${esc(`${method}-${path}`)}">
<h3><span class="m m-${esc(method)}">${esc(method.toUpperCase())}</span> <code>${esc(path)}</code></h3>
<p>${esc(op['summary'])}</p>${op['description'] ? `<p class="d">${esc(op['description'])}</p>` : ''}
${rows ? `<table><thead><tr><th>Parameter</th><th>In</th><th>Required</th><th>Type</th><th>Description</th></tr></thead><tbody>${rows}</tbody></table>` : ''}
${body ? `<p><strong>Body</strong> ${content(body['content'])}</p>` : ''}
<ul class="r">${responses}</ul></article>`;
}

function schemaSection(name: string, s: Json): string {
  const parts = Array.isArray(s['allOf']) ? (s['allOf'] as Json[]) : [s];
  const props = parts.flatMap((p) => Object.entries((p['properties'] as Json | undefined) ?? {}));
  const req = new Set(parts.flatMap((p) => (p['required'] as string[] | undefined) ?? []));
  const base = parts.filter((p) => p['$ref']).map(schemaName).join(', ');
  const rows = props.map(([k, v]) => `<tr><td><code>${esc(k)}</code>${req.has(k) ? '' : '?'}</td><td>${schemaName(v)}</td><td>${esc((v as Json)['description'])}</td></tr>`).join('');
  return `<section class="schema" id="schema-${esc(name)}"><h3>${esc(name)}</h3>${s['description'] ? `<p>${esc(s['description'])}</p>` : ''}${base ? `<p>Extends ${base}.</p>` : ''}${rows ? `<table><tbody>${rows}</tbody></table>` : `<p>${schemaName(s)}</p>`}</section>`;
}

/** The HTML page for an OpenAPI 3.1 document. */
export function renderApiHtml(spec: Json): string {
  const info = spec['info'] as Json;
  const paths = spec['paths'] as Record<string, Json>;
  const byTag = new Map<string, string[]>();
  for (const [path, item] of Object.entries(paths)) {
    for (const m of METHODS) {
      const op = item[m] as Json | undefined;
      if (!op) continue;
      const tag = ((op['tags'] as string[] | undefined) ?? ['other'])[0]!;
      if (!byTag.has(tag)) byTag.set(tag, []);
      byTag.get(tag)!.push(operation(m, path, op));
    }
  }
  const schemas = Object.entries(((spec['components'] as Json | undefined)?.['schemas'] as Record<string, Json> | undefined) ?? {});
  const nav = [...byTag.keys()].map((t) => `<li><a href="#tag-${esc(t)}">${esc(t)}</a></li>`).join('');
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${esc(info['title'])} — API</title>
<link rel="stylesheet" href="/api/docs/docs.css"></head>
<body><header><h1>${esc(info['title'])} <small>${esc(info['version'])}</small></h1><p>${esc(info['description'])}</p>
<p>Machine-readable description: <a href="/api/docs/openapi.yaml">openapi.yaml</a> (OpenAPI ${esc(spec['openapi'])}).</p></header>
<nav aria-label="Sections"><ul>${nav}<li><a href="#schemas">Schemas</a></li></ul></nav>
<main>${[...byTag].map(([t, ops]) => `<section id="tag-${esc(t)}"><h2>${esc(t)}</h2>${ops.join('\n')}</section>`).join('\n')}
<section id="schemas"><h2>Schemas</h2>${schemas.map(([n, s]) => schemaSection(n, s)).join('\n')}</section></main></body></html>`;
}

/** Stylesheet of the page (served from the same origin: the CSP allows self only). */
export const DOCS_CSS = `body{font:15px/1.5 system-ui,sans-serif;margin:0 auto;max-width:64rem;padding:1rem 1.5rem;color:#1d2327}
h1 small{font-size:.6em;color:#555}nav ul{display:flex;flex-wrap:wrap;gap:.25rem 1rem;list-style:none;padding:0}
.op{border:1px solid #d6dadf;border-radius:6px;padding:.25rem 1rem;margin:.75rem 0}.op h3{font-size:1rem}
.m{display:inline-block;min-width:4.2em;text-align:center;border-radius:4px;color:#fff;font-size:.8em;padding:.1em .4em}
.m-get{background:#2f6f4f}.m-post{background:#2a5d9f}.m-put{background:#7a5a12}.m-patch{background:#6b4a8a}.m-delete{background:#9b2c2c}
table{border-collapse:collapse;margin:.5rem 0}td,th{border:1px solid #e1e4e8;padding:.2rem .5rem;text-align:left;vertical-align:top}
code{font-family:ui-monospace,monospace}.d{color:#444}a{color:#1f5b9a}`;
