import { afterEach, beforeEach, describe, expect, inject, it } from 'vitest';
import { openBrowser, screenshot, signInAs, type BrowserSession } from '../support/browser.js';

const day = (offsetDays: number) => new Date(Date.now() + offsetDays * 86_400_000).toISOString().slice(0, 10);

describe('editing a station in Setup', () => {
  const appUrl = inject('appUrl');
  let browser: BrowserSession;
  beforeEach(async () => { browser = await openBrowser(); });
  afterEach(async () => { await browser.close(); });

  it('when admin edits a calibrated station and moves its due date into the past, then it shows as expired, the history stays and the change is audited', async () => {
    const { page } = browser;
    await signInAs(page, appUrl, 'admin');
    await expect.poll(() => page.getByRole('navigation', { name: 'Screens' }).getByRole('link', { name: 'Setup' }).count()).toBe(1);
    await page.goto(`${appUrl}/setup?section=stations`);

    await page.getByRole('button', { name: 'New station' }).click();
    const create = page.getByRole('form', { name: 'New station' });
    await create.getByLabel('Code').fill('EOL-C7');
    await create.getByLabel('Name').fill('End-of-line stand C7');
    await create.getByLabel('Line').fill('C');
    await create.getByLabel('Calibration due').fill(day(20));
    await create.getByRole('button', { name: 'Create station' }).click();
    const row = page.getByRole('row').filter({ hasText: 'EOL-C7' }).first();
    await row.waitFor();

    await row.getByRole('button', { name: 'Calibration of EOL-C7' }).click();
    const record = page.getByRole('form', { name: 'Record a calibration of EOL-C7' });
    await record.getByLabel('Calibrated on').fill(day(-2));
    await record.getByLabel('Next due').fill(day(180));
    await record.getByLabel('Certificate').fill('MCL-9001');
    await record.getByRole('button', { name: 'Record calibration' }).click();
    const history = page.getByRole('table', { name: 'Calibration history of EOL-C7' });
    await expect.poll(() => history.innerText()).toContain('MCL-9001');

    await row.getByRole('button', { name: 'Edit EOL-C7' }).click();
    const edit = page.getByRole('form', { name: 'Edit station EOL-C7' });
    expect(await edit.getByLabel('Code').getAttribute('readonly')).not.toBeNull();
    await edit.getByLabel('Name').fill('Pack-out stand C7');
    await edit.getByLabel('Kind').fill('eol-dc');
    await edit.getByLabel('Calibration due').fill(day(-1));
    await expect.poll(() => edit.getByRole('note').innerText()).toMatch(/Calibration expired/);
    await edit.getByRole('button', { name: 'Save station' }).click();
    // The server refuses a moved due date without a reason, and says which field.
    await expect.poll(() => edit.getByRole('alert').innerText()).toMatch(/reason/);
    await screenshot(page, 'setup-station-edit-form');
    await edit.getByLabel(/^Reason/).fill('Reference shunt damaged; stand out of use until re-certified');
    await edit.getByRole('button', { name: 'Save station' }).click();
    await edit.waitFor({ state: 'detached' });

    await expect.poll(() => row.innerText()).toMatch(/Pack-out stand C7[\s\S]*eol-dc[\s\S]*expired/i);
    await row.getByRole('button', { name: 'Calibration of EOL-C7' }).click();
    await expect.poll(() => history.innerText()).toContain('MCL-9001');
    await expect.poll(() => page.getByText(/was set by editing the station/).count()).toBe(1);
    await screenshot(page, 'setup-station-edited');

    const audit = await page.request.get(`${appUrl}/api/v1/audit/events?entityType=station&entityId=EOL-C7`);
    const events = JSON.stringify(await audit.json());
    expect(events).toContain('station.updated');
    expect(events).toContain('Reference shunt damaged; stand out of use until re-certified');
  });
});
