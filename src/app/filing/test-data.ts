import type { DatasetPreview } from '../../../shared/api/workflow';

/** An invented upload (Harrow Vale tutoring pilot) for the filing specs. */
export function sampleDataset(over: Partial<DatasetPreview> = {}): DatasetPreview {
  return {
    id: 'd1', filename: 'tutoring-pilot.csv', format: 'csv', sizeBytes: 2048, sha256: 'ab'.repeat(32), rows: 96,
    columns: [
      { name: 'student_code', kind: 'identifier-like', missing: 0, distinct: 96, examples: ['S001', 'S002'] },
      { name: 'format', kind: 'categorical', missing: 0, distinct: 2, examples: ['drop-in', 'scheduled'] },
      { name: 'credits', kind: 'numeric', missing: 3, distinct: 14, examples: ['12', '15'], min: 3, max: 18 },
    ],
    previewRows: [['S001', 'drop-in', '12'], ['S002', 'scheduled', '']],
    identifierFindings: [], identifierConfirmations: [], blocked: false, derivedFrom: null, revisionNo: 0,
    uploadedAt: '2026-11-30T10:00:00Z',
    ...over,
  };
}
