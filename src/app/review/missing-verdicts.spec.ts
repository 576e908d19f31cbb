import { HttpErrorResponse } from '@angular/common/http';
import { missingVerdicts } from './missing-verdicts';

const err = (status: number, error: unknown) => new HttpErrorResponse({ status, error });

describe('missingVerdicts', () => {
  it('reads criteria from field keys, keeping checklist order', () => {
    expect(missingVerdicts(err(422, { error: { message: 'x', fields: { 'checklist.outliers': 'a', 'checklist.independence': 'b' } } }))).toEqual(['independence', 'outliers']);
  });
  it('finds criterion ids named in the message', () => {
    expect(missingVerdicts(err(422, { error: { message: 'Missing: sample-size-power.' } }))).toEqual(['sample-size-power']);
  });
  it('ignores other statuses', () => {
    expect(missingVerdicts(err(409, { error: { message: 'outliers' } }))).toEqual([]);
  });
});
