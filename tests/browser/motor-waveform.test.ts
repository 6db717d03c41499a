import { afterEach, beforeAll, beforeEach, describe, expect, inject, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { openBrowser, screenshot, signInAs, type BrowserSession } from '../support/browser.js';
import { testPorts } from '../support/ports.js';
import { clientToken } from '../support/sign-in.js';
import { syntheticSpin } from '../support/synthetic-back-emf.js';

// A PM-150 run with a back-EMF spin and readings, posted by the demo stand EOL-A1 (client
// demo-station) into the demo plant, so the test does not depend on which demo motors carry waveforms.
const serial = `PM150-99${String(Date.now() % 10_000).padStart(4, '0')}`;

async function postWaveformRun(appUrl: string) {
  const token = await clientToken(`http://127.0.0.1:${testPorts.browserIdp}`, 'demo-station', 'demo-station-secret', { scope: 'test-runs:write' });
  const finished = new Date(Date.now() - 60_000);
  const fundamentalPeakV = 48 * Math.SQRT2;
  const document = {
    runId: randomUUID(), serial, product: 'PM-150', station: 'EOL-A1', lot: 'L2611-12',
    startedAt: new Date(finished.getTime() - 4 * 60_000).toISOString(), finishedAt: finished.toISOString(),
    operatorBadge: 'B-2207', programVersion: 'eol-pmsm 4.1.0',
    results: [
      { characteristic: 'winding_temp', value: 24.5, unit: '°C' },
      { characteristic: 'hipot_voltage', value: 2040, unit: 'V' },
      { characteristic: 'hipot_leakage', value: 1.4, unit: 'mA' },
    ],
    waveforms: [syntheticSpin({
      sampleRateHz: 20_000, speedRpm: 1000, polePairs: 4, samples: 4096, resolverOffsetDeg: 11.8,
      harmonicsPeakV: { 1: fundamentalPeakV, 5: 0.018 * fundamentalPeakV, 7: 0.009 * fundamentalPeakV },
    })],
    readings: [
      { kind: 'insulation', resistanceMegohm: 1450, windingTempC: 24.5, testVoltageV: 1000, r30sMegohm: 1050, r60sMegohm: 1450 },
      // IEC 60034-1 for 350 V: 1000 + 2 × 350 = 1700 V, × 1.2 for the 1 s routine test = 2040 V.
      { kind: 'hipot', voltageV: 2040, leakageMa: 1.4, durationS: 1, acOrDc: 'ac' },
      // 9.80 mΩ at 20 °C read at 24.5 °C (k = 235): 9.80 × 259.5/255 = 9.973 mΩ.
      { kind: 'winding-resistance', uOhm: 0.009973, vOhm: 0.009985, wOhm: 0.009961, windingTempC: 24.5 },
    ],
  };
  const response = await fetch(`${appUrl}/api/v1/test-runs`, {
    method: 'POST', headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' }, body: JSON.stringify(document),
  });
  if (response.status !== 201) throw new Error(`posting the waveform run answered ${response.status}: ${await response.text()}`);
}

describe('Motor record: back-EMF waveform, spectrum and raw readings in Chromium', () => {
  const appUrl = inject('appUrl');
  let browser: BrowserSession;
  beforeAll(async () => { await postWaveformRun(appUrl); });
  beforeEach(async () => { browser = await openBrowser(); });
  afterEach(async () => { await browser.close(); });

  it('when quality opens a motor record whose run carries a back-EMF spin, then the traces, spectrum, resolver offset and readings show', async () => {
    const { page } = browser;
    await signInAs(page, appUrl, 'quality');
    await expect.poll(() => page.getByRole('navigation', { name: 'Screens' }).isVisible()).toBe(true);
    await page.goto(`${appUrl}/motors/${serial}`);
    const trace = page.getByRole('figure', { name: 'Back-EMF line-to-line voltages' });
    await expect.poll(() => trace.locator('canvas').count(), { timeout: 20_000 }).toBeGreaterThan(0);
    await expect.poll(() => page.getByRole('figure', { name: 'Harmonic spectrum' }).locator('canvas').count()).toBeGreaterThan(0);
    const panel = page.getByRole('region', { name: 'Waveforms and raw readings' });
    await expect.poll(() => panel.getByText('U-V-W').isVisible()).toBe(true);
    await expect.poll(() => panel.getByText(/crosses zero going positive/).isVisible()).toBe(true);
    await expect.poll(() => panel.getByRole('note', { name: 'High-voltage caution' }).isVisible()).toBe(true);
    await expect.poll(() => panel.getByText('11.80').first().isVisible()).toBe(true);
    await trace.scrollIntoViewIfNeeded();
    await screenshot(page, 'motor-waveform');
  });
});
