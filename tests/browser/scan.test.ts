import { afterEach, beforeEach, describe, expect, inject, it } from 'vitest';
import { openBrowser, screenshot, signInAs, type BrowserSession } from '../support/browser.js';
import { demoSerials } from '../../seeds/demo/notable.js';

describe('the Scan screen, as an operator with a keyboard-wedge scanner', () => {
  const appUrl = inject('appUrl');
  let browser: BrowserSession;
  beforeEach(async () => { browser = await openBrowser(); });
  afterEach(async () => { await browser.close(); });

  it('when operator scans demo serials, then each decision fills the screen with a word', async () => {
    const { page } = browser;
    await signInAs(page, appUrl, 'operator');
    await expect.poll(() => page.url()).toContain('/scan');
    const serial = page.getByLabel('Serial');
    const decision = page.getByRole('region', { name: 'Release decision' });

    // A scanner types the serial and Enter into whatever has focus: the serial field must have it.
    const serialFocused = () => serial.evaluate((el) => el === document.activeElement);
    await expect.poll(serialFocused).toBe(true);
    await page.keyboard.type(demoSerials.passing);
    await page.keyboard.press('Enter');
    await expect.poll(() => decision.getAttribute('data-decision')).toBe('may ship');
    expect(await decision.getByRole('status').innerText()).toContain('MAY SHIP');
    const steps = page.getByRole('list', { name: 'Test steps' }).getByRole('listitem');
    expect(await steps.count()).toBeGreaterThan(5);
    await screenshot(page, 'scan-may-ship');

    await expect.poll(serialFocused).toBe(true);
    await page.keyboard.type(demoSerials.onCalibrationHold);
    await page.keyboard.press('Enter');
    await expect.poll(() => decision.getAttribute('data-decision')).toBe('on hold');
    expect(await page.getByRole('list', { name: 'Active holds' }).innerText()).toMatch(/calibration/i);
    await screenshot(page, 'scan-on-hold');

    await expect.poll(serialFocused).toBe(true);
    await page.keyboard.type(demoSerials.damagedMagnet);
    await page.keyboard.press('Enter');
    await expect.poll(() => decision.getAttribute('data-decision')).toBe('must not ship');
    const firstStep = page.getByRole('list', { name: 'Test steps' }).getByRole('listitem').first();
    expect(await firstStep.getAttribute('data-verdict')).toBe('fail');
    await screenshot(page, 'scan-must-not-ship');

    await expect.poll(serialFocused).toBe(true);
    await page.keyboard.type('PM150-999999');
    await page.keyboard.press('Enter');
    await expect.poll(() => decision.getAttribute('data-decision')).toBe('not found');
    expect(await page.getByRole('list', { name: 'Recent scans' }).innerText()).toContain(demoSerials.passing);
  });
});
