import { afterEach, beforeEach, describe, expect, inject, it } from 'vitest';
import { openBrowser, screenshot, signInAs, type BrowserSession } from '../support/browser.js';

describe('the plant shift calendar in Setup', () => {
  const appUrl = inject('appUrl');
  let browser: BrowserSession;
  beforeEach(async () => { browser = await openBrowser(); });
  afterEach(async () => { await browser.close(); });

  it('when admin changes the first-pass target with a reason, then it is saved and audited', async () => {
    const { page } = browser;
    await signInAs(page, appUrl, 'admin');
    await expect.poll(() => page.getByRole('navigation', { name: 'Screens' }).getByRole('link', { name: 'Setup' }).count()).toBe(1);
    await page.goto(`${appUrl}/setup?section=shifts`);
    const form = page.getByRole('form', { name: 'Shift calendar' });
    await form.waitFor();
    expect(await form.getByRole('table', { name: 'Shifts' }).getByRole('row').count()).toBe(4); // header + three default shifts
    await form.getByLabel('First-pass yield target (0–1)').fill('0.96');
    await form.getByLabel('Reason').fill('Plant target raised for 2027');
    await form.getByRole('button', { name: 'Save the shift calendar' }).click();
    await expect.poll(() => form.getByText('Shift calendar saved.').isVisible()).toBe(true);
    await screenshot(page, 'setup-shift-calendar');
    const calendar = await page.request.get(`${appUrl}/api/v1/yield/shift-calendar`);
    expect((await calendar.json()).firstPassTarget).toBe(0.96);
    const audit = await page.request.get(`${appUrl}/api/v1/audit/events?entityType=shift_calendar`);
    expect(JSON.stringify(await audit.json())).toContain('Plant target raised for 2027');
  });
});
