import type { DatasetPreview } from '../../../shared/api/workflow';

/** The dataset a submission uses: the most recently uploaded or reshaped one. */
export function currentDataset(list: DatasetPreview[]): DatasetPreview | null {
  if (!list.length) return null;
  return [...list].sort((a, b) => a.uploadedAt.localeCompare(b.uploadedAt)).at(-1) ?? null;
}
