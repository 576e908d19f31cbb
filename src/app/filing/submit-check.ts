import type { DatasetPreview } from '../../../shared/api/workflow';
import { requestCreateSchema } from '../../../shared/api/schemas';
import { parseReported } from '../../../shared/stats/apa/parse';
import { planProblems } from '../../../shared/review/plan-mapping';
import type { DraftFields } from './filing-draft';

/**
 * Problems the form can see before asking the server, keyed like the server's: the title,
 * the plan check, the data file and each reported line. The server's dry run checks the
 * plan against the data as well.
 */
export function localProblems(f: DraftFields, dataset: DatasetPreview | null): Record<string, string> {
  const out: Record<string, string> = {};
  const title = requestCreateSchema.shape.title.safeParse(f.title);
  if (!title.success) out['title'] = title.error.issues[0]?.message ?? 'Title is required';
  Object.assign(out, planProblems(f.plan));
  if (!dataset) out['dataset'] = 'Upload the data file the analysis uses.';
  else if (dataset.blocked) out['dataset'] = 'Some columns look like personal identifiers: remove them or say why they are needed.';
  f.reported.forEach((r, i) => {
    const p = parseReported(r.text);
    if (!p.ok) out[`reported.${i}`] = `Could not read this result: ${p.message}.`;
  });
  return out;
}
