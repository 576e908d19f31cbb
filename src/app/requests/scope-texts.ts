import type { RequestState } from '../../../shared/api/types';
import type { RequestScope } from './request-service';

/** Words and defaults that differ between the three request lists. */
export interface ScopeTexts {
  heading: string;
  lede: string;
  emptyHeading: string;
  emptyHint: string;
  /** Which person the "person" column shows. */
  person: 'submitter' | 'reviewer';
  /** States offered as filter chips. */
  states: RequestState[];
  /** Initial sort. */
  sort: { active: string; direction: 'asc' | 'desc' };
}

/** Texts per scope. */
export const SCOPE_TEXTS: Record<RequestScope, ScopeTexts> = {
  mine: {
    heading: 'My requests',
    lede: 'Requests you have drafted or filed with the office, and where each one stands.',
    emptyHeading: 'You have not filed any requests yet.',
    emptyHint: 'When you file an analysis for methods review it appears here with its state and due date.',
    person: 'reviewer',
    states: ['draft', 'filed', 'assigned', 'in-review', 'revision-requested', 'decided', 'withdrawn'],
    sort: { active: 'updatedAt', direction: 'desc' },
  },
  assigned: {
    heading: 'Assigned to me',
    lede: 'Requests the office head has assigned to you, soonest due first.',
    emptyHeading: 'Nothing is assigned to you right now.',
    emptyHint: 'The office head assigns incoming requests; they will appear here with their due dates.',
    person: 'submitter',
    states: ['assigned', 'in-review', 'revision-requested', 'decided'],
    sort: { active: 'dueAt', direction: 'asc' },
  },
  intake: {
    heading: 'Intake queue',
    lede: 'Every filed request in the office. Oldest filings first, so nothing waits unseen.',
    emptyHeading: 'The intake queue is empty.',
    emptyHint: 'Filed requests from the departments appear here for assignment.',
    person: 'submitter',
    states: ['filed', 'assigned', 'in-review', 'revision-requested', 'decided', 'withdrawn'],
    sort: { active: 'filedAt', direction: 'asc' },
  },
};
