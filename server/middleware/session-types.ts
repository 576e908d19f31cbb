/** Type additions: what we keep in the session and on the request. */
import 'express-session';
import 'pino-http';
import type { Role } from '../../shared/api/types';

/** The signed-in person as middleware resolves it for each request. */
export interface CurrentUser {
  id: string;
  email: string;
  name: string;
  roles: Role[];
  officeId: string;
  departmentId: string | null;
  department: string | null;
}

declare module 'express-session' {
  interface SessionData {
    userId?: string;
    csrfToken?: string;
  }
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** The signed-in person, when there is one. */
      me?: CurrentUser;
    }
  }
}
