/** Date arithmetic and the median behind the workload board. */
import { describe, expect, it } from 'vitest';
import { addDays, dueStatus, median } from './workload';

describe('workload helpers', () => {
  it('median of odd and even lists, null when empty', () => {
    expect(median([5, 1, 3])).toBe(3);
    expect(median([4, 1, 3, 10])).toBe(3.5);
    expect(median([])).toBeNull();
  });
  it('adds calendar days across month and year ends', () => {
    expect(addDays('2026-12-30', 3)).toBe('2027-01-02');
    expect(addDays('2028-02-28', 1)).toBe('2028-02-29');
  });
  it('classifies due dates against today and the due-soon window (inclusive)', () => {
    expect(dueStatus('2026-11-30', '2026-12-01', 3)).toBe('overdue');
    expect(dueStatus('2026-12-01', '2026-12-01', 3)).toBe('due-soon');
    expect(dueStatus('2026-12-04', '2026-12-01', 3)).toBe('due-soon');
    expect(dueStatus('2026-12-05', '2026-12-01', 3)).toBeNull();
    expect(dueStatus(null, '2026-12-01', 3)).toBeNull();
  });
});
