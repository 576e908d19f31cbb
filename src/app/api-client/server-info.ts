import type { Health } from '../../../shared/api/types';

/**
 * GET /api/health as the app reads it: the shared shape plus two optional fields the
 * sign-in page and top bar use when the server provides them.
 */
export interface ServerInfo extends Health {
  /** True when the server runs with the seeded demo office; the sign-in page then lists demo accounts. */
  demo?: boolean;
  /** The office this installation serves, shown in the top bar. */
  office?: { name: string; institution?: string | null };
}
