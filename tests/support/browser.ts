import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { mkdtempSync, mkdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export type BrowserSession = { context: BrowserContext; page: Page; close(): Promise<void> };

/** Debian's Chromium, headless, with a fresh profile (flags from STACK.md). */
export async function openBrowser(): Promise<BrowserSession> {
  const profile = mkdtempSync(join(tmpdir(), 'fluxtrail-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1366, height: 900 },
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  const page = context.pages()[0] ?? await context.newPage();
  return {
    context, page,
    async close() {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** Goes from the app's sign-in page to the IdP's own form and submits it, as a person would. */
export async function submitSignIn(page: Page, appUrl: string, login: string, password: string) {
  await page.goto(`${appUrl}/`);
  await page.getByRole('link', { name: /sign in/i }).or(page.getByRole('button', { name: /sign in/i })).first().click();
  await page.locator('input[name="login"]').fill(login);
  await page.locator('input[name="password"]').fill(password);
  await page.getByRole('button', { name: /sign in/i }).click();
}

/**
 * Signs in and returns once the app knows who is signed in (its top bar offers to sign out): on
 * a busy machine the way back from the IdP takes seconds, longer than a test's short polls for
 * the landing screen.
 */
export async function signInAs(page: Page, appUrl: string, login: string, password = 'fluxtrail') {
  await submitSignIn(page, appUrl, login, password);
  await page.getByRole('link', { name: 'Sign out' }).waitFor();
}

/** Screenshots for people to look at, kept under .data/screenshots. */
export async function screenshot(page: Page, name: string) {
  mkdirSync('.data/screenshots', { recursive: true });
  await page.screenshot({ path: `.data/screenshots/${name}.png`, fullPage: true });
}
