/**
 * Sign-in and roles in a real browser: each demo account signs in with the local form
 * and through the fake institution sign-in, sees the navigation its roles allow, and is
 * kept out of pages for other roles.
 */
import { describe, it, expect } from 'vitest';
import { useBrowser, signInLocally } from './support';

const ACCOUNTS = [
  { email: 'submitter@demo.test', key: 'submitter', sees: ['My requests'], notSees: ['People and roles', 'Intake queue'] },
  { email: 'reviewer@demo.test', key: 'reviewer', sees: ['Assigned to me'], notSees: ['People and roles', 'Intake queue'] },
  { email: 'reviewer2@demo.test', key: 'reviewer2', sees: ['Assigned to me'], notSees: ['People and roles'] },
  { email: 'head@demo.test', key: 'head', sees: ['Intake queue'], notSees: ['People and roles'] },
  { email: 'admin@demo.test', key: 'admin', sees: ['People and roles', 'Audit log'], notSees: ['Intake queue'] },
];

describe('sign-in in the browser', () => {
  const b = useBrowser();

  it('shows the sign-in page with institution sign-in, the local form and the caution', async () => {
    const page = await b.newPage();
    await page.goto('/');
    await page.waitForURL(/\/sign-in/);
    await expect(page.getByRole('link', { name: /Sign in with your institution/ }).count()).resolves.toBe(1);
    await expect(page.getByLabel('E-mail').count()).resolves.toBe(1);
    const text = await page.locator('body').innerText();
    expect(text).toMatch(/statistical method only/i);
    // Demo mode lists the demo accounts.
    expect(text).toContain('submitter@demo.test');
    await b.shot(page, 'sign-in');
  });

  it('says plainly when the password is wrong', async () => {
    const page = await b.newPage();
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill('submitter@demo.test');
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in with e-mail' }).click();
    await page.getByText(/do not match|not recognised|incorrect|wrong/i).first().waitFor();
    expect(page.url()).toContain('/sign-in');
  });

  for (const a of ACCOUNTS) {
    it(`signs in ${a.email} locally and shows only its role's navigation`, async () => {
      const page = await b.newPage();
      await signInLocally(page, a.email);
      const nav = page.getByRole('navigation').first();
      await nav.waitFor();
      const navText = await nav.innerText();
      for (const s of a.sees) expect(navText).toContain(s);
      for (const s of a.notSees) expect(navText).not.toContain(s);
      await page.locator('main').waitFor();
      await b.shot(page, `start-${a.key}`);
    });
  }

  it('keeps a submitter out of the admin pages', async () => {
    const page = await b.newPage();
    await signInLocally(page, 'submitter@demo.test');
    await page.goto('/admin/people');
    await page.waitForLoadState('networkidle');
    const text = await page.locator('main').innerText();
    expect(text).not.toContain('reviewer2@demo.test');
    expect(page.url()).not.toMatch(/\/admin\/people$/);
  });

  it('signs in through the fake institution identity provider and signs out', async () => {
    const page = await b.newPage();
    await page.goto('/sign-in');
    await page.getByRole('link', { name: /Sign in with your institution/ }).click();
    await page.waitForURL(/\/fake-idp\//);
    await b.shot(page, 'fake-idp');
    await page.locator('[data-person="head"]').click();
    await page.waitForURL((url) => !url.pathname.startsWith('/fake-idp') && !url.pathname.startsWith('/sign-in'));
    const nav = await page.getByRole('navigation').first().innerText();
    expect(nav).toContain('Intake queue');
    // Sign out from the person menu.
    await page.getByRole('button', { name: /account|person|menu|signed in/i }).first().click();
    await page.getByRole('menuitem', { name: /Sign out/i }).click();
    await page.waitForURL(/\/sign-in/);
  });

  it('lists the submitter\'s own requests from the API in a sortable table', async () => {
    const page = await b.newPage();
    await signInLocally(page, 'submitter@demo.test');
    await page.goto('/requests/mine');
    await page.getByRole('table').waitFor();
    const rows = page.getByRole('row');
    await expect(rows.count()).resolves.toBeGreaterThan(2);
    const body = await page.getByRole('table').innerText();
    expect(body).toMatch(/HV-2026-\d{3}/);
    await b.shot(page, 'my-requests');
  });
});
