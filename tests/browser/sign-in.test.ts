import { afterEach, beforeEach, describe, expect, inject, it } from 'vitest';
import { openBrowser, screenshot, signInAs, submitSignIn, type BrowserSession } from '../support/browser.js';
import { testPorts } from '../support/ports.js';

describe('signing in through the IdP fake in Chromium', () => {
  const appUrl = inject('appUrl');
  let browser: BrowserSession;
  beforeEach(async () => { browser = await openBrowser(); });
  afterEach(async () => { await browser.close(); });

  it('when operator signs in, then the operator navigation shows and sign-out ends the session', async () => {
    const { page } = browser;
    await page.goto(`${appUrl}/`);
    await screenshot(page, 'signin-page');
    await signInAs(page, appUrl, 'operator');
    const nav = page.getByRole('navigation', { name: 'Screens' });
    await expect.poll(() => nav.getByRole('link').allInnerTexts()).toEqual(['Scan', 'Motors', 'Lots']);
    await expect.poll(() => page.url()).toContain('/scan');
    await screenshot(page, 'shell-operator');
    await page.getByRole('link', { name: /sign out/i }).click();
    await expect.poll(() => page.url()).toContain('/signed-out');
    const me = await page.request.get(`${appUrl}/api/me`);
    expect(me.status()).toBe(401);
  });

  it('when the password is wrong, then the IdP form refuses it with a message', async () => {
    const { page } = browser;
    await submitSignIn(page, appUrl, 'operator', 'wrong-password');
    await expect.poll(() => page.getByText('Wrong login or password.').isVisible()).toBe(true);
    expect(new URL(page.url()).port).toBe(String(testPorts.browserIdp));
  });

  it('when quality signs in, then the quality screens show and operator-only ones do not', async () => {
    const { page } = browser;
    await signInAs(page, appUrl, 'quality');
    const nav = page.getByRole('navigation', { name: 'Screens' });
    await expect.poll(() => nav.getByRole('link').allInnerTexts()).toContain('Signals');
    const links = await nav.getByRole('link').allInnerTexts();
    expect(links).toContain('Setup');
    expect(links).not.toContain('Audit trail');
    await screenshot(page, 'shell-quality');
  });
});
