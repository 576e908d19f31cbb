import { HttpErrorResponse } from '@angular/common/http';
import { CRITERIA, type Criterion } from '../../../shared/api/types';

/**
 * Reads the criteria still without a verdict from a 422 on POST /decision. Accepts the
 * shapes the server may use: `error.missing: Criterion[]`, field keys such as
 * "checklist.outliers", or criterion ids named in the message.
 */
export function missingVerdicts(err: unknown): Criterion[] {
  if (!(err instanceof HttpErrorResponse) || err.status !== 422) return [];
  const e = (err.error as { error?: { message?: unknown; fields?: Record<string, unknown>; missing?: unknown } } | null)?.error;
  if (!e) return [];
  const found = new Set<Criterion>();
  if (Array.isArray(e.missing)) for (const m of e.missing) if ((CRITERIA as readonly string[]).includes(String(m))) found.add(m as Criterion);
  const texts = [...Object.keys(e.fields ?? {}), ...Object.values(e.fields ?? {}).map(String), typeof e.message === 'string' ? e.message : ''];
  for (const c of CRITERIA) if (texts.some((t) => new RegExp(`(^|[^a-z-])${c}($|[^a-z-])`).test(t))) found.add(c);
  return CRITERIA.filter((c) => found.has(c));
}
