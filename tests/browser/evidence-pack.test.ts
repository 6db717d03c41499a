import { afterEach, beforeEach, describe, expect, inject, it } from 'vitest';
import { createHash } from 'node:crypto';
import { openBrowser, screenshot, signInAs, type BrowserSession } from '../support/browser.js';
import { driftingLotCode } from '../../seeds/demo/notable.js';

describe('an auditor builds, downloads and verifies an evidence pack', () => {
  const appUrl = inject('appUrl');
  let browser: BrowserSession;
  beforeEach(async () => { browser = await openBrowser(); });
  afterEach(async () => { await browser.close(); });

  it('when auditor packs the demo drifting lot, then the download hashes to the SHA-256 shown and the audit chain verifies', async () => {
    const { page } = browser;
    await signInAs(page, appUrl, 'auditor');
    await expect.poll(() => page.getByRole('navigation', { name: 'Screens' }).getByRole('link', { name: 'Evidence packs' }).count()).toBe(1);
    await page.goto(`${appUrl}/evidence-packs`);
    await page.getByTestId('pack-lots').fill(driftingLotCode);
    await page.getByTestId('pack-create').click();
    const row = page.getByTestId('pack-row').first();
    await expect.poll(() => row.getAttribute('data-status'), { timeout: 60_000 }).toBe('done');
    await screenshot(page, 'evidence-pack-done');
    const shownSha = (await row.getByTestId('pack-sha256').innerText()).trim();
    expect(shownSha).toMatch(/^[0-9a-f]{64}$/);

    const [download] = await Promise.all([page.waitForEvent('download'), row.getByTestId('pack-download').click()]);
    const path = await download.path();
    const { readFile } = await import('node:fs/promises');
    const bytes = await readFile(path);
    expect(createHash('sha256').update(bytes).digest('hex')).toBe(shownSha);

    await page.goto(`${appUrl}/audit`);
    await page.getByTestId('audit-verify').click();
    const result = page.getByTestId('audit-verify-result');
    await expect.poll(() => result.getAttribute('data-ok'), { timeout: 30_000 }).toBe('true');
    await screenshot(page, 'audit-verified');
  });
});
