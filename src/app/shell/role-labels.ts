import type { Role } from '../../../shared/api/types';

/** Human names of roles, as the office says them. */
export const ROLE_LABELS: Record<Role, string> = {
  submitter: 'Submitter',
  reviewer: 'Reviewer',
  head: 'Office head',
  admin: 'Administrator',
};
