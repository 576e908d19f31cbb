/**
 * The review workflow in a real browser, on the seeded demo office: the reviewer reruns
 * an assigned request and sees the results and the checklist's automatic findings; the
 * head sees the workload board; anyone can verify the demo's signed letter on the public
 * page, and an altered copy is reported as altered.
 */
import { describe, it, expect } from 'vitest';
import type { Page } from 'playwright-core';
import { baseUrl, useBrowser, signInLocally } from './support';

/** GET an API path with the page's cookies (persistent contexts have no baseURL). */
const apiGet = (page: Page, path: string) => page.request.get(new URL(path, baseUrl()).toString());

interface Summary { id: string; reference: string; state: string }

describe('review workflow in the browser', () => {
  const b = useBrowser();

  it('lets the assigned reviewer rerun a request and shows results and checklist findings', async () => {
    const page = await b.newPage();
    await signInLocally(page, 'reviewer@demo.test');
    const list = await apiGet(page, '/api/requests?scope=assigned&pageSize=50');
    const mine = ((await list.json()) as { items: Summary[] }).items.find((r) => r.state === 'in-review' || r.state === 'assigned');
    expect(mine, 'the demo seed assigns a request to reviewer@demo.test').toBeTruthy();
    await page.goto(`/requests/${mine!.id}/review`);
    await page.getByRole('button', { name: /Rerun on the server/ }).click();
    // Progress, then the result's reporting lines (F tests in this design).
    await page.getByText(/F\(\d+(\.\d+)?, \d+(\.\d+)?\) = /).first().waitFor({ timeout: 60_000 });
    // The checklist reloads its automatic findings when the rerun finishes.
    await page.getByText('Independence of observations').first().waitFor();
    await page.getByText(/AUTOMATIC FINDING/i).first().waitFor();
    await b.shot(page, 'review-workspace');
  });

  it('shows the head the workload board with its turnaround chart', async () => {
    const page = await b.newPage();
    await signInLocally(page, 'head@demo.test');
    await page.goto('/workload');
    await page.getByRole('img').first().waitFor();
    const text = await page.locator('main').innerText();
    expect(text).toMatch(/reviewer|Reviewer/);
    await b.shot(page, 'workload');
  });

  it('verifies the demo letter by code and flags an altered copy', async () => {
    const page = await b.newPage();
    await signInLocally(page, 'submitter@demo.test');
    const list = (await (await apiGet(page, '/api/requests?scope=mine&pageSize=50')).json()) as { items: Summary[] };
    const decided = list.items.find((r) => r.state === 'decided');
    expect(decided, 'the demo seed has a decided request').toBeTruthy();
    const letters = (await (await apiGet(page, `/api/requests/${decided!.id}/letters`)).json()) as { code: string; downloadUrl: string }[];
    expect(letters.length).toBeGreaterThan(0);
    const pdf = Buffer.from(await (await apiGet(page, letters[0].downloadUrl)).body());
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');

    // A visitor who is not signed in.
    const visitor = await b.newPage();
    await visitor.goto(`/verify/${letters[0].code}`);
    await visitor.getByText('Valid and current').first().waitFor();
    await b.shot(visitor, 'verify-valid');

    // Flip one byte inside the signed content and upload the copy.
    const altered = Buffer.from(pdf);
    const at = Math.floor(altered.length / 3);
    altered[at] = altered[at] ^ 0x01;
    await visitor.goto('/verify');
    await visitor.locator('input[type="file"]').setInputFiles({ name: 'letter.pdf', mimeType: 'application/pdf', buffer: altered });
    await visitor.getByText(/Altered/).first().waitFor();
    await b.shot(visitor, 'verify-altered');
  });

  it('lets an assigned reviewer declare a conflict, which sends the request back to the head', async () => {
    const page = await b.newPage();
    await signInLocally(page, 'reviewer2@demo.test');
    const list = (await (await apiGet(page, '/api/requests?scope=assigned&pageSize=50')).json()) as { items: Summary[] };
    const target = list.items.find((r) => r.state === 'assigned' || r.state === 'in-review');
    expect(target, 'the demo seed assigns a request to reviewer2@demo.test').toBeTruthy();
    await page.goto(`/requests/${target!.id}/review`);
    await page.getByRole('button', { name: /Decline or declare a conflict/ }).click();
    await page.getByRole('radio', { name: /conflict of interest/ }).check();
    await page.getByLabel('Note for the office head').fill('I advised the department on this analysis last spring.');
    await b.shot(page, 'decline-dialog');
    await page.getByRole('button', { name: /^Decline$/ }).click();
    await page.waitForURL(/\/requests\/assigned/);
    const head = await b.newPage();
    await signInLocally(head, 'head@demo.test');
    const after = (await (await apiGet(head, `/api/requests/${target!.id}`)).json()) as Summary;
    expect(after.state).toBe('filed');
  });
});
