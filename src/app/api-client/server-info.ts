import type { Health } from '../../../shared/api/types';

/** GET /api/health as the app reads it: status, whether the demo office is seeded, and the office's name. */
export type ServerInfo = Health;
