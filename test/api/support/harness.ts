/**
 * Sets up one API test file: a database (see database.ts) migrated from scratch and
 * seeded with the demo office, the app built with createApp(), and helpers to sign in
 * as the demo people. Call inside describe(): `const h = useApiHarness();`.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Express, Router } from 'express';
import type { Sequelize } from 'sequelize';
import { afterAll, beforeAll } from 'vitest';
import { createApp } from '../../../server/app';
import { loadConfig, type Config } from '../../../server/config';
import { DEMO_PEOPLE } from '../../../server/db/demo-people';
import { seedDemo } from '../../../server/db/seed';
import { createSequelize } from '../../../server/db/sequelize';
import { keysDirFor } from '../../../server/services/office-keys';
import { startFakeSmtp, type FakeSmtpHandle } from '../../../server/ops/fake-smtp';
import { ReviewRequest, User } from '../../../server/models/index';
import { ApiClient } from './client';
import { acquireDatabase, resetSchema, type TestDatabase } from './database';

/** Password of the demo accounts in tests. */
export const TEST_PASSWORD = 'assayer-test-password';

/** Everything a test file needs. */
export interface ApiHarness {
  app: Express;
  sequelize: Sequelize;
  config: Config;
  /** A new visitor (own cookie jar). */
  client(): ApiClient;
  /** A visitor already signed in locally as a demo person (key from DEMO_PEOPLE, e.g. "head"). */
  as(personKey: string): Promise<ApiClient>;
  /** Builds another app on the same database with changed settings (e.g. a low rate limit) or extra routes. */
  appWith(env: Record<string, string>, extraApiRouters?: Record<string, Router>): Express;
  /** Id of a seeded request by reference (HV-2026-00n). */
  requestId(reference: string): Promise<string>;
  /** Id of a demo person by key. */
  userId(personKey: string): Promise<string>;
}

/** E-mail of a demo person by key. */
export function emailOf(personKey: string): string {
  const p = DEMO_PEOPLE.find((x) => x.key === personKey);
  if (!p) throw new Error(`no demo person ${personKey}`);
  return p.email;
}

/** Registers beforeAll/afterAll hooks and returns the harness (usable inside tests). */
export function useApiHarness(): ApiHarness {
  let db: TestDatabase;
  let runDir: string;
  let smtp: FakeSmtpHandle | null = null;
  const h = {} as ApiHarness;
  const envFor = (extra: Record<string, string> = {}) => ({
    ...process.env, NODE_ENV: 'test', LOG_LEVEL: process.env['LOG_LEVEL'] ?? 'silent', RUN_DIR: runDir,
    PUBLIC_URL: 'http://127.0.0.1:4280', DEMO_PASSWORD: TEST_PASSWORD, BCRYPT_ROUNDS: '4', DATABASE_URL: db.url, ...extra,
  });

  beforeAll(async () => {
    db = await acquireDatabase();
    runDir = fs.mkdtempSync(path.join(os.tmpdir(), 'assayer-api-run-'));
    // A single file run has no mail server from npm test: start one so e-mail can be asserted on (test/api/support/mail.ts).
    if (!process.env['SMTP_URL']) {
      smtp = await startFakeSmtp({ dir: path.join(runDir, 'mail') });
      process.env['SMTP_URL'] = smtp.url;
      process.env['MAIL_DIR'] = smtp.dir;
    }
    const config = loadConfig(envFor());
    const sequelize = createSequelize(db.url);
    await resetSchema(sequelize);
    // Sign the demo letter with the keys the test app reads (its own run folder), not .run/keys.
    await seedDemo(sequelize, { password: TEST_PASSWORD, rounds: 4, keysDir: keysDirFor(runDir), publicUrl: 'http://127.0.0.1:4280' });
    Object.assign(h, {
      sequelize, config,
      app: createApp({ sequelize, config }),
      client: () => new ApiClient(h.app),
      as: async (key: string) => {
        const c = new ApiClient(h.app);
        const res = await c.login(emailOf(key), TEST_PASSWORD);
        if (res.status !== 200) throw new Error(`sign-in as ${key} failed: ${res.status} ${res.text}`);
        return c;
      },
      appWith: (env: Record<string, string>, extraApiRouters?: Record<string, Router>) => createApp({ sequelize, config: loadConfig(envFor(env)), extraApiRouters }),
      requestId: async (reference: string) => (await ReviewRequest.findOne({ where: { reference }, rejectOnEmpty: true })).id,
      userId: async (key: string) => (await User.findOne({ where: { email: emailOf(key) }, rejectOnEmpty: true })).id,
    } satisfies ApiHarness);
  });

  afterAll(async () => {
    if (smtp) {
      await smtp.stop();
      delete process.env['SMTP_URL'];
      delete process.env['MAIL_DIR'];
    }
    await h.sequelize?.close();
    await db?.stop();
    if (runDir) fs.rmSync(runDir, { recursive: true, force: true });
  });

  return h;
}
