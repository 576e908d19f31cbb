/** One seeded demo account, listed on the sign-in page when the server runs in demo mode. */
export interface DemoAccount {
  email: string;
  role: string;
  does: string;
}

/** The seeded demo office's accounts (the start command creates exactly these). */
export const DEMO_ACCOUNTS: readonly DemoAccount[] = [
  { email: 'submitter@demo.test', role: 'Submitter', does: 'files and revises requests' },
  { email: 'reviewer@demo.test', role: 'Reviewer', does: 'works an assigned queue' },
  { email: 'reviewer2@demo.test', role: 'Reviewer', does: 'a second office statistician' },
  { email: 'head@demo.test', role: 'Office head', does: 'assigns incoming requests' },
  { email: 'admin@demo.test', role: 'Administrator', does: 'people, roles and the audit log' },
];

/** Password the start command gives demo accounts unless DEMO_PASSWORD overrides it. */
export const DEFAULT_DEMO_PASSWORD = 'assayer-demo';
