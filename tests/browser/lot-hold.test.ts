import { afterEach, beforeEach, describe, expect, inject, it } from 'vitest';
import { openBrowser, screenshot, signInAs, type BrowserSession } from '../support/browser.js';

describe('holding a lot from its page', () => {
  const appUrl = inject('appUrl');
  let browser: BrowserSession;
  beforeEach(async () => { browser = await openBrowser(); });
  afterEach(async () => { await browser.close(); });

  it('when quality holds a lot, then the hold button gives way to the hold in force, and a second hold is refused with 409', async () => {
    const { page } = browser;
    await signInAs(page, appUrl, 'quality');
    await expect.poll(() => page.getByRole('navigation', { name: 'Screens' }).getByRole('link', { name: 'Lots' }).count()).toBe(1);
    await page.goto(`${appUrl}/lots/L2631-02`);
    await page.getByRole('button', { name: 'Hold this lot' }).click();
    const dialog = page.getByRole('dialog', { name: 'Hold lot L2631-02' });
    await dialog.getByLabel(/Reason/).fill('Stator varnish batch under investigation');
    await dialog.getByRole('button', { name: 'Place hold' }).click();
    const note = page.getByText(/^On manual hold since .* \(hold \d+\)/);
    await note.waitFor();
    expect(await page.getByRole('button', { name: 'Hold this lot' }).count()).toBe(0);
    await screenshot(page, 'lot-on-manual-hold');

    const again = await page.request.post(`${appUrl}/api/v1/lots/L2631-02/holds`, {
      headers: { 'x-fluxtrail-csrf': '1', origin: appUrl }, data: { reason: 'Same batch, second report' },
    });
    expect(again.status()).toBe(409);
    expect((await again.json()).error.fields[0].field).toBe('code');
  });
});
