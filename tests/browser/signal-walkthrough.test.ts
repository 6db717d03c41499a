import { afterEach, beforeEach, describe, expect, inject, it } from 'vitest';
import { openBrowser, screenshot, signInAs, type BrowserSession } from '../support/browser.js';

describe('a quality engineer answers an SPC signal of the demo drifting lot', () => {
  const appUrl = inject('appUrl');
  let browser: BrowserSession;
  beforeEach(async () => { browser = await openBrowser(); });
  afterEach(async () => { await browser.close(); });

  it('when quality opens an open signal, contains it and closes it, then its status follows each step', async () => {
    const { page } = browser;
    await signInAs(page, appUrl, 'quality');
    await expect.poll(() => page.getByRole('navigation', { name: 'Screens' }).getByRole('link', { name: 'Signals' }).count()).toBe(1);
    await page.goto(`${appUrl}/signals`);
    // The button reads "Open" until the count of open signals arrives, then "Open (3)".
    await page.getByRole('button', { name: /^Open( \(\d+\))?$/ }).click();
    const firstSignal = page.getByRole('link', { name: /^Signal \d+/ }).first();
    await firstSignal.waitFor();
    await screenshot(page, 'signals-inbox');
    await firstSignal.click();

    const status = page.getByTestId('signal-status');
    await expect.poll(() => status.innerText()).toMatch(/open/i);
    await page.getByRole('img', { name: /Control chart around signal/ }).waitFor();
    const affected = page.getByRole('region', { name: 'Motors since the first violating point' });
    await expect.poll(() => affected.getByRole('link').count()).toBeGreaterThan(0);
    await screenshot(page, 'signal-open');

    const actions = page.getByRole('region', { name: 'Signal actions' });
    await actions.getByRole('button', { name: 'Acknowledge' }).click();
    await expect.poll(() => status.innerText()).toMatch(/acknowledged/i);

    await actions.getByLabel('Containment note').fill('Ke drifting up across the lot; hold until magnet lot checked');
    await actions.getByRole('button', { name: 'Contain: hold affected motors' }).click();
    await expect.poll(() => status.innerText()).toMatch(/contained/i);
    await expect.poll(() => affected.innerText()).toMatch(/on hold/i);
    await screenshot(page, 'signal-contained');

    await actions.getByLabel('Cause').fill('Magnet lot at the top of its remanence tolerance');
    await actions.getByLabel('Action taken').fill('Magnet lot quarantined; motors retested on a calibrated stand');
    await actions.getByLabel('Outcome').selectOption({ label: 'Motors released (holds lifted)' });
    await actions.getByRole('button', { name: 'Close signal' }).click();
    await expect.poll(() => status.innerText()).toMatch(/closed/i);
    await screenshot(page, 'signal-closed');
  });
});
