import { afterEach, beforeEach, describe, expect, inject, it } from 'vitest';
import { openBrowser, screenshot, type BrowserSession } from '../support/browser.js';

describe('the API documentation page', () => {
  const appUrl = inject('appUrl');
  let browser: BrowserSession;
  beforeEach(async () => { browser = await openBrowser(); });
  afterEach(async () => { await browser.close(); });

  it('when it is opened, then every route renders, the upload with its multipart form', async () => {
    const { page } = browser;
    await page.goto(`${appUrl}/api/docs`);
    const upload = page.getByRole('heading', { name: /^POST\s*\/api\/v1\/uploads$/ });
    await upload.waitFor();
    expect(await page.getByRole('heading', { name: /^POST\s*\/api\/v1\/uploads\/\{id\}\/commit$/ }).count()).toBe(1);
    const form = page.getByText('Request body, multipart/form-data');
    expect(await form.count()).toBe(1);
    await form.click();
    await expect.poll(() => page.locator('details[open] pre').innerText()).toContain('"format": "binary"');
    // Every operation rendered, those after the upload too: the script did not stop at the multipart body.
    expect(await page.getByRole('heading', { level: 2 }).count()).toBe(16);
    await upload.scrollIntoViewIfNeeded();
    await screenshot(page, 'api-docs-uploads');
  });
});
