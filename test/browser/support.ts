/**
 * Browser suite support: one headless Chromium (Debian's, through playwright-core) per
 * test file, against the app that `npm test` serves on BASE_URL with the seeded demo
 * office. Profiles and screenshots go under BROWSER_DIR (inside the test run folder).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';

/** Password of the demo accounts (the orchestrator seeds with DEMO_PASSWORD or the default). */
export const DEMO_PASSWORD = process.env['DEMO_PASSWORD'] ?? 'assayer-demo';

/** Address of the app under test. */
export function baseUrl(): string {
  const url = process.env['ASSAYER_URL'];
  if (!url) throw new Error('ASSAYER_URL is not set: run the browser suite through `npm test` (or ONLY=browser npm test), which serves the app first.');
  return url;
}

/** What a browser test file gets. */
export interface BrowserHarness {
  /** A fresh page in a fresh context (own cookies). */
  newPage(): Promise<Page>;
  /** Saves a full-page screenshot under the run folder and returns its path. */
  shot(page: Page, name: string): Promise<string>;
}

const LAUNCH_ARGS = ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--disable-dev-shm-usage'];

/** Registers hooks that start and stop Chromium for this file. */
export function useBrowser(): BrowserHarness {
  const root = process.env['BROWSER_DIR'] ?? fs.mkdtempSync(path.join(os.tmpdir(), 'assayer-browser-'));
  const contexts: BrowserContext[] = [];
  const shots = path.join(root, 'screenshots');
  let n = 0;

  beforeAll(() => {
    fs.mkdirSync(shots, { recursive: true });
    // Chromium writes caches and crash data under these; keep them inside the run folder.
    for (const v of ['XDG_CONFIG_HOME', 'XDG_CACHE_HOME']) process.env[v] = path.join(root, v.toLowerCase());
  });

  afterAll(async () => {
    for (const c of contexts) await c.close().catch(() => undefined);
  });

  return {
    async newPage() {
      const dir = path.join(root, `profile-${process.pid}-${++n}`);
      const context = await chromium.launchPersistentContext(dir, {
        executablePath: process.env['CHROMIUM_PATH'] ?? '/usr/bin/chromium',
        headless: true,
        args: LAUNCH_ARGS,
        viewport: { width: 1280, height: 860 },
      });
      contexts.push(context);
      const page = context.pages()[0] ?? (await context.newPage());
      page.setDefaultTimeout(20_000);
      // Persistent contexts ignore baseURL: resolve relative paths ourselves.
      const goto = page.goto.bind(page);
      page.goto = (url, opts) => goto(new URL(url, baseUrl()).toString(), opts);
      return page;
    },
    async shot(page, name) {
      const file = path.join(shots, `${name}.png`);
      await page.screenshot({ path: file, fullPage: true });
      return file;
    },
  };
}

/** Signs in with the local form as a demo account and waits for the first page after sign-in. */
export async function signInLocally(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in with e-mail' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}
