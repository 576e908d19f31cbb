import { daysUntil } from '../intake/calendar-days';

/** How a due date stands today. */
export type DueStatus = 'overdue' | 'due-soon' | 'on-track' | 'none';

/** Words and icons per status, so the marker never relies on colour alone. */
export const DUE_STATUS_TEXT: Record<DueStatus, { label: string; icon: string }> = {
  overdue: { label: 'Overdue', icon: 'running_with_errors' },
  'due-soon': { label: 'Due soon', icon: 'schedule' },
  'on-track': { label: 'On track', icon: 'event_available' },
  none: { label: 'No due date', icon: 'event_busy' },
};

/** Classifies a due date: overdue when past, due soon within `dueSoonDays` calendar days (inclusive). */
export function dueStatus(dueAt: string | null, dueSoonDays: number, now: Date = new Date()): DueStatus {
  if (!dueAt) return 'none';
  const days = daysUntil(dueAt, now);
  if (days < 0) return 'overdue';
  if (days <= dueSoonDays) return 'due-soon';
  return 'on-track';
}
