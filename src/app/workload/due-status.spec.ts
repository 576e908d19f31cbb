import { addDaysIso, daysSince } from '../intake/calendar-days';
import { dueStatus } from './due-status';

describe('dueStatus', () => {
  const now = new Date(2026, 11, 1, 15, 30);
  it('classifies by calendar days, inclusive of the due-soon window', () => {
    expect(dueStatus(null, 3, now)).toBe('none');
    expect(dueStatus('2026-11-30', 3, now)).toBe('overdue');
    expect(dueStatus('2026-12-01', 3, now)).toBe('due-soon');
    expect(dueStatus('2026-12-04', 3, now)).toBe('due-soon');
    expect(dueStatus('2026-12-05', 3, now)).toBe('on-track');
  });
  it('adds days across month and year ends', () => {
    expect(addDaysIso('2026-12-20', 15)).toBe('2027-01-04');
    expect(addDaysIso('2026-02-20', 10)).toBe('2026-03-02');
  });
  it('counts whole days since a filing', () => {
    expect(daysSince(new Date(2026, 10, 24, 23, 0).toISOString(), now)).toBe(7);
    expect(daysSince(new Date(2026, 11, 1, 1, 0).toISOString(), now)).toBe(0);
  });
});
