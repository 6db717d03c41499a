import { afterEach, beforeEach, describe, expect, inject, it } from 'vitest';
import { openBrowser, screenshot, signInAs, type BrowserSession } from '../support/browser.js';

describe('two-person approval of a limit revision in Setup', () => {
  const appUrl = inject('appUrl');
  let browser: BrowserSession;
  beforeEach(async () => { browser = await openBrowser(); });
  afterEach(async () => { await browser.close(); });

  it('when quality2 drafts a revision, then quality (not its author) approves it and it is in force', async () => {
    const { page } = browser;
    await signInAs(page, appUrl, 'quality2');
    await expect.poll(() => page.getByRole('navigation', { name: 'Screens' }).getByRole('link', { name: 'Setup' }).count()).toBe(1);
    await page.goto(`${appUrl}/setup?section=limits&product=IM-4P`);
    await page.getByRole('button', { name: 'New draft from the revision in force' }).click();
    const usl = page.getByLabel('USL for no_load_current');
    await usl.waitFor();
    const before = Number(await usl.inputValue());
    await usl.fill(String(before - 0.1));
    await page.getByRole('button', { name: 'Save draft' }).click();
    await expect.poll(() => page.getByText('Draft saved.').isVisible()).toBe(true);
    await expect.poll(() => page.getByText('You wrote this revision, so a second quality user approves it.').isVisible()).toBe(true);
    await page.getByRole('link', { name: /sign out/i }).click();
    await expect.poll(() => page.url()).toContain('/signed-out');

    await signInAs(page, appUrl, 'quality');
    await expect.poll(() => page.getByRole('navigation', { name: 'Screens' }).getByRole('link', { name: 'Setup' }).count()).toBe(1);
    await page.goto(`${appUrl}/setup?section=limits&product=IM-4P`);
    const draftButton = page.getByRole('list', { name: 'Limit revisions' }).getByRole('button', { name: /draft/ });
    await draftButton.click();
    const form = page.getByRole('form', { name: /Approve revision \d+/ });
    await form.waitFor();
    await screenshot(page, 'setup-approve-draft');
    await form.getByLabel('Reason').fill('Second signature: no-load current limit tightened');
    await form.getByRole('button', { name: /Approve revision/ }).click();
    await expect.poll(() => page.getByRole('list', { name: 'Limit revisions' }).getByRole('button', { name: /approved/ }).count()).toBeGreaterThan(1);
    await expect.poll(() => page.getByRole('list', { name: 'Limit revisions' }).getByRole('button', { name: /draft/ }).count()).toBe(0);
    await screenshot(page, 'setup-approved');
  });
});
