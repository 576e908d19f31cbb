/** Compares two rerun results for reproduction: same JSON, timings left aside. */

/** Timing fields differ between runs of the same input by nature; they are not part of the result proper. */
const IGNORED = new Set(['timings']);

/** JSON paths at which the two values differ (at most `limit`), ignoring timing fields at the top level. */
export function resultDifferences(a: unknown, b: unknown, limit = 20): string[] {
  const out: string[] = [];
  const walk = (x: unknown, y: unknown, path: string, top: boolean) => {
    if (out.length >= limit) return;
    if (Object.is(x, y)) return;
    if (Array.isArray(x) && Array.isArray(y)) {
      if (x.length !== y.length) out.push(`${path || '$'} (length ${x.length} vs ${y.length})`);
      for (let i = 0; i < Math.min(x.length, y.length); i++) walk(x[i], y[i], `${path}[${i}]`, false);
      return;
    }
    if (x && y && typeof x === 'object' && typeof y === 'object' && !Array.isArray(x) && !Array.isArray(y)) {
      const keys = new Set([...Object.keys(x), ...Object.keys(y)]);
      for (const k of keys) {
        if (top && IGNORED.has(k)) continue;
        walk((x as Record<string, unknown>)[k], (y as Record<string, unknown>)[k], path ? `${path}.${k}` : k, false);
      }
      return;
    }
    out.push(path || '$');
  };
  walk(a, b, '', true);
  return out;
}
