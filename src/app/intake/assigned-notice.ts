/** What the assignment page hands back to the intake queue (router state) for its confirmation. */
export interface AssignedNotice {
  reference: string;
  reviewer: string;
  dueAt: string | null;
  reassigned: boolean;
}

/** The confirmation sentence for a notice. */
export function assignedNoticeText(n: AssignedNotice): string {
  return `${n.reference} ${n.reassigned ? 'reassigned' : 'assigned'} to ${n.reviewer}${n.dueAt ? `, due ${n.dueAt}` : ''}. They have been notified.`;
}

/** Reads a notice from the router's history state, or null. */
export function readAssignedNotice(state: unknown): AssignedNotice | null {
  const s = state as { assigned?: AssignedNotice } | null;
  return s && typeof s === 'object' && s.assigned && typeof s.assigned.reference === 'string' ? s.assigned : null;
}
