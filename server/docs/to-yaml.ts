/**
 * Writes a JSON value as block-style YAML (the subset OpenAPI files use): mappings,
 * sequences and scalars, with strings quoted whenever plain style could change their meaning.
 */

const PLAIN = /^[A-Za-z_/][A-Za-z0-9 _./{}()'-]*$/;
const RESERVED = /^(true|false|null|yes|no|on|off|y|n|~)$/i;

function scalar(v: unknown): string {
  if (v === null || v === undefined) return 'null';
  if (typeof v === 'number' || typeof v === 'boolean') return String(v);
  const s = String(v);
  if (PLAIN.test(s) && !RESERVED.test(s) && !s.endsWith(' ') && !/: |\s#/.test(s)) return s;
  return JSON.stringify(s);
}

const isObj = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const key = (k: string) => (PLAIN.test(k) && !RESERVED.test(k) ? k : JSON.stringify(k));

function emit(v: unknown, indent: string, out: string[]): void {
  if (isObj(v)) {
    for (const [k, x] of Object.entries(v)) {
      if (x === undefined) continue;
      if ((isObj(x) && Object.keys(x).length) || (Array.isArray(x) && x.length)) {
        out.push(`${indent}${key(k)}:`);
        emit(x, `${indent}  `, out);
      } else out.push(`${indent}${key(k)}: ${isObj(x) ? '{}' : Array.isArray(x) ? '[]' : scalar(x)}`);
    }
  } else if (Array.isArray(v)) {
    for (const x of v) {
      if ((isObj(x) && Object.keys(x).length) || (Array.isArray(x) && x.length)) {
        const inner: string[] = [];
        emit(x, `${indent}  `, inner);
        out.push(`${indent}- ${inner[0]!.trimStart()}`, ...inner.slice(1));
      } else out.push(`${indent}- ${isObj(x) ? '{}' : Array.isArray(x) ? '[]' : scalar(x)}`);
    }
  } else out.push(`${indent}${scalar(v)}`);
}

/** The value as a YAML document. */
export function toYaml(value: unknown): string {
  const out: string[] = [];
  emit(value, '', out);
  return `${out.join('\n')}\n`;
}
