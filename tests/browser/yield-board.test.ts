import { afterEach, beforeEach, describe, expect, inject, it } from 'vitest';
import { openBrowser, screenshot, signInAs, type BrowserSession } from '../support/browser.js';

describe('Yield board in Chromium on the demo plant', () => {
  const appUrl = inject('appUrl');
  let browser: BrowserSession;
  beforeEach(async () => { browser = await openBrowser(); });
  afterEach(async () => { await browser.close(); });

  it('when manager opens the board and picks the top Pareto bar, then the motors whose first test failed it are listed', async () => {
    const { page } = browser;
    await signInAs(page, appUrl, 'manager');
    await expect.poll(() => page.url()).toBe(`${appUrl}/yield`);
    const pareto = page.getByRole('region', { name: 'Where first tests fail (Pareto)' });
    const firstRow = pareto.locator('tbody tr').first();
    await firstRow.waitFor();
    await expect.poll(() => page.getByTestId('yield-headline').getByText('First-pass yield').count()).toBe(2);
    expect(await page.getByTitle(/^First-pass yield = motors passing their first test/).count()).toBeGreaterThan(0);
    await page.locator('canvas').first().waitFor();
    await screenshot(page, 'yield-board');

    const characteristic = (await firstRow.locator('button').innerText()).trim();
    const failures = Number((await firstRow.locator('td').nth(1).innerText()).replace(/,/g, ''));
    expect(failures).toBeGreaterThan(0);
    await firstRow.locator('button').click();
    await expect.poll(() => new URL(page.url()).searchParams.get('drill')).toBe(`characteristic:${characteristic}`);

    const drill = page.getByTestId('yield-drill');
    await expect.poll(() => drill.getByRole('heading').innerText()).toContain(`whose first test failed ${characteristic}`);
    // One measurement per characteristic and run, so the failures counted are the motors listed.
    await expect.poll(() => drill.getByRole('heading').innerText()).toContain(`${failures.toLocaleString('en-US')} motors`);
    const rows = drill.locator('tbody tr');
    await expect.poll(() => rows.count()).toBe(Math.min(failures, 200));
    const firstVerdicts = await rows.locator('td:nth-child(6)').allInnerTexts();
    expect(firstVerdicts.every((text) => text.includes('fail'))).toBe(true);
    await screenshot(page, 'yield-board-pareto-drill');

    const serial = (await rows.first().getByRole('link').innerText()).trim();
    await rows.first().getByRole('link').click();
    await expect.poll(() => page.url()).toContain(`/motors/${encodeURIComponent(serial)}`);
  });

  it('when a line is chosen, then the filter lives in the URL and a reload shows the same view', async () => {
    const { page } = browser;
    await signInAs(page, appUrl, 'manager');
    await expect.poll(() => page.url()).toBe(`${appUrl}/yield`);
    const lineSelect = page.getByRole('combobox', { name: 'Line', exact: true });
    await expect.poll(() => lineSelect.locator('option').count()).toBeGreaterThan(1);
    const line = await lineSelect.locator('option').nth(1).getAttribute('value');
    await lineSelect.selectOption(line ?? '');
    await expect.poll(() => new URL(page.url()).searchParams.get('line')).toBe(line);
    await page.reload();
    await expect.poll(() => page.getByRole('combobox', { name: 'Line', exact: true }).inputValue()).toBe(line);
    const byLine = page.getByRole('region', { name: 'Yield by line' });
    await byLine.locator('canvas').waitFor();
    await screenshot(page, 'yield-board-one-line');
  });
});
