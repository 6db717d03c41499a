import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { gunzipSync } from 'node:zlib';
import { startApiServer } from '../support/api-server.js';
import { truncateAll } from '../support/migrate.js';
import { clientToken, signIn } from '../support/sign-in.js';
import { idpUrl } from '../support/ports.js';
import { canonicalBytes, syntheticSpin } from '../support/synthetic-back-emf.js';
import type { RunningServer } from '../../server/index.js';
import { jsonColumn } from '../../server/db/json-column.js';
import { createLimitSet, createLot, createProduct, createStation, runDocument, type CharacteristicSpec, type PlantFixture } from '../factories.js';

// The PM-150 demo product's derived codes (seeds/demo/products.ts) with its revision-1 limits.
const spec = (code: string, unit: string, testStep: string, lsl: number | null, usl: number | null, derived = true): CharacteristicSpec =>
  ({ code, unit, testStep, lsl, usl, derived, demoValue: 0 });
const pmCharacteristics: CharacteristicSpec[] = [
  { ...spec('winding_temp', '°C', 'winding-resistance', null, null, false), demoValue: 75 },
  spec('r_u_20c', 'mΩ', 'winding-resistance', 95, 105), spec('r_v_20c', 'mΩ', 'winding-resistance', 95, 105),
  spec('r_w_20c', 'mΩ', 'winding-resistance', 95, 105), spec('r_unbalance', '%', 'winding-resistance', null, 2),
  spec('ir_40c', 'MΩ', 'insulation', 20, null), spec('dar', '1', 'insulation', 1.2, null),
  { ...spec('hipot_leakage', 'mA', 'hipot', null, 5, false), demoValue: 1.2 },
  spec('ke', 'V/krpm', 'back-emf', 45.6, 50.4), spec('emf_frequency', 'Hz', 'back-emf', 66, 67.33),
  spec('emf_thd', '%', 'back-emf', null, 3), spec('emf_unbalance', '%', 'back-emf', null, 1),
  spec('phase_sequence', '1', 'back-emf', 1, 1), spec('phase_spacing_dev', 'deg el', 'back-emf', null, 1),
  spec('resolver_offset', 'deg el', 'resolver', 7, 17),
];

// 1000 rpm, 4 pole pairs → 66.667 Hz; 4096 samples at 20 kHz hold 13.65 cycles (not whole, on purpose).
const fundamentalPeakV = 48 * Math.SQRT2;
const spin = (overrides: Partial<Parameters<typeof syntheticSpin>[0]> = {}) => syntheticSpin({
  sampleRateHz: 20_000, speedRpm: 1000, polePairs: 4, samples: 4096, resolverOffsetDeg: 12.5,
  harmonicsPeakV: { 1: fundamentalPeakV, 5: 0.02 * fundamentalPeakV, 7: 0.01 * fundamentalPeakV }, ...overrides,
});
const readings = [
  // IEEE Std 43-2013 example: 200 MΩ at 20 °C → 50 MΩ at 40 °C; DAR 210/150 = 1.4.
  { kind: 'insulation', resistanceMegohm: 200, windingTempC: 20, testVoltageV: 1000, r30sMegohm: 150, r60sMegohm: 210 },
  { kind: 'hipot', voltageV: 1800, leakageMa: 1.2, durationS: 1, acOrDc: 'ac' },
  // IEC 60034-1, k = 235: 0.12157 Ω at 75 °C is 0.1000 Ω at 20 °C; V 1 % high, W 1 % low.
  { kind: 'winding-resistance', uOhm: 0.12157, vOhm: 0.12157 * 1.01, wOhm: 0.12157 * 0.99, windingTempC: 75 },
] as const;

const valueOf = (body: { results: Array<{ characteristic: string; value: number; verdict: string }> }, code: string) =>
  body.results.find((r) => r.characteristic === code);

function blobFiles(root: string): string[] {
  if (!existsSync(root)) return [];
  return readdirSync(root, { recursive: true, encoding: 'utf8' }).filter((f) => statSync(join(root, f)).isFile());
}

describe('waveform ingest: derived back-EMF, resolver and readings, blob store and display', () => {
  let server: RunningServer;
  let token: string;
  let plant: PlantFixture;
  const post = (body: object) => request(server.url).post('/api/v1/test-runs').set('authorization', `Bearer ${token}`).send(body);
  const blobRoot = () => join(server.config.dataDir, 'blobs');

  beforeAll(async () => {
    server = await startApiServer();
    token = await clientToken(idpUrl, 'demo-station', 'demo-station-secret', { scope: 'test-runs:write' });
  });
  afterAll(async () => { await server.stop(); });
  beforeEach(async () => {
    await truncateAll(server.db);
    const product = await createProduct(server.db, { characteristics: pmCharacteristics });
    plant = { product, limitSet: await createLimitSet(server.db, product), station: await createStation(server.db), lot: await createLot(server.db, product) };
  });

  it('when a run carries a back-EMF spin and readings, then the derived results are judged, stored with the summary, readings and blob, and shown down-sampled', async () => {
    const waveform = spin();
    const document = runDocument(plant, { waveforms: [waveform], readings: [...readings] });
    const body = (await post(document).expect(201)).body;

    expect(body.verdict).toBe('pass');
    // Ke = V₁,LL,rms/(n/1000) (DOMAIN.md, standard PMSM relation): 48 V rms at 1000 rpm → 48 V/krpm.
    expect(valueOf(body, 'ke')).toMatchObject({ unit: 'V/krpm', verdict: 'pass', lsl: 45.6, usl: 50.4 });
    expect(valueOf(body, 'ke')?.value).toBeCloseTo(48, 3);
    // IEEE Std 519-2014: THD = √(V₅² + V₇²)/V₁ = √(2² + 1²) % = 2.2361 %.
    expect(valueOf(body, 'emf_thd')?.value).toBeCloseTo(Math.hypot(2, 1), 3);
    // f = p·n/60 (common practice): 4 × 1000/60 = 66.667 Hz.
    expect(valueOf(body, 'emf_frequency')?.value).toBeCloseTo(66.6667, 3);
    expect(valueOf(body, 'emf_unbalance')?.value).toBeCloseTo(0, 3);
    expect(valueOf(body, 'phase_sequence')).toMatchObject({ value: 1, verdict: 'pass' });
    expect(valueOf(body, 'phase_spacing_dev')?.value).toBeCloseTo(0, 3);
    expect(valueOf(body, 'resolver_offset')?.value).toBeCloseTo(12.5, 2);
    // IEEE Std 43-2013: R₄₀ = 200 × 0.5^((40 − 20)/10) = 50 MΩ; DAR = 1.4.
    expect(valueOf(body, 'ir_40c')?.value).toBeCloseTo(50, 6);
    expect(valueOf(body, 'dar')?.value).toBeCloseTo(1.4, 6);
    // IEC 60034-1: 0.12157 × (235 + 20)/(235 + 75) = 0.100 Ω = 100.0 mΩ; NEMA MG 1 unbalance 1 %.
    expect(valueOf(body, 'r_u_20c')?.value).toBeCloseTo(100.0, 1);
    expect(valueOf(body, 'r_unbalance')?.value).toBeCloseTo(1, 6);

    const run = await server.db('test_runs').where({ run_uuid: document.runId }).first('id');
    expect(await server.db('measurements').where({ run_id: run.id }).count({ n: '*' })).toEqual([{ n: pmCharacteristics.length }]);
    const stored = await server.db('waveforms').where({ run_id: run.id }).first();
    expect(stored).toMatchObject({ kind: 'back-emf', sample_rate_hz: 20_000, speed_rpm: 1000, samples_per_channel: 4096 });
    expect(jsonColumn(stored.summary_json)).toMatchObject({ sequence: 'UVW', polePairsFromFrequency: 4, resolver: { resolverPolePairs: 4 } });
    const kept = await server.db('raw_readings').where({ run_id: run.id }).orderBy('kind').select('kind', 'reading_json');
    expect(kept.map((r) => r.kind)).toEqual(['hipot', 'insulation', 'winding-resistance']);
    expect(jsonColumn(kept[0].reading_json)).toEqual({ voltageV: 1800, leakageMa: 1.2, durationS: 1, acOrDc: 'ac' });

    const sha = stored.blob_sha256 as string;
    const expected = canonicalBytes([waveform.lineToLineV.uv, waveform.lineToLineV.vw, waveform.lineToLineV.wu, waveform.resolverAngleDeg]);
    expect(sha).toBe(createHash('sha256').update(expected).digest('hex'));
    const file = join(blobRoot(), sha.slice(0, 2), sha.slice(2, 4), sha);
    const uncompressed = gunzipSync(readFileSync(file));
    expect(createHash('sha256').update(uncompressed).digest('hex')).toBe(sha);
    expect(uncompressed.equals(expected)).toBe(true);

    // Signed in after the tables are emptied, since sessions live in the database too.
    const quality = (await signIn(server.url, 'quality')).cookie;
    const display = (await request(server.url).get(`/api/v1/motors/${document.serial}/runs/${document.runId}/waveforms/back-emf`)
      .set('cookie', quality).expect(200)).body;
    expect(display).toMatchObject({ kind: 'back-emf', samplesPerChannel: 4096, downsampled: true, blobSha256: sha });
    for (const line of ['uv', 'vw', 'wu']) {
      expect(display.lineToLineV[line].length).toBeLessThanOrEqual(4000);
      expect(display.lineToLineV[line].length).toBeGreaterThan(3000);
    }
    // The envelope keeps every bucket's extremes, so the record's peak survives down-sampling.
    const peak = Math.max(...waveform.lineToLineV.uv);
    expect(Math.max(...display.lineToLineV.uv.map((p: [number, number]) => p[1]))).toBeCloseTo(peak, 3);
    expect(display.spectrum).toHaveLength(24);
    expect(display.spectrum.find((s: { order: number }) => s.order === 5).uv).toBeCloseTo(2, 3);

    const record = (await request(server.url).get(`/api/v1/motors/${document.serial}`).set('cookie', quality).expect(200)).body;
    expect(record.runs[0].waveforms[0]).toMatchObject({ kind: 'back-emf', summary: { sequence: 'UVW' } });
    expect(record.runs[0].readings.map((r: { kind: string }) => r.kind)).toEqual(['hipot', 'insulation', 'winding-resistance']);
  });

  it('when a waveform holds more than 500k samples per channel, then the run is refused with 413 and nothing is stored', async () => {
    const before = blobFiles(blobRoot());
    const oversized = Array.from({ length: 500_001 }, (_, n) => n % 7);
    const document = runDocument(plant, { waveforms: [{ kind: 'back-emf', sampleRateHz: 20_000, speedRpm: 1000, lineToLineV: { uv: oversized, vw: oversized, wu: oversized } }] });
    const response = await post(document).expect(413);
    expect(response.body.error).toMatchObject({ code: 'payload_too_large', fields: [{ field: 'waveforms[0].lineToLineV.uv' }] });
    expect(response.body.error.message).toContain('500000');
    expect(await server.db('test_runs').count({ n: '*' })).toEqual([{ n: 0 }]);
    expect(await server.db('waveforms').count({ n: '*' })).toEqual([{ n: 0 }]);
    expect(blobFiles(blobRoot())).toEqual(before);
  });

  it('when a stand posts a value for a characteristic its own raw data derives, then the run is refused with 422 naming that result', async () => {
    const document = runDocument(plant, { waveforms: [spin()] });
    document.results.push({ characteristic: 'ke', value: 48, unit: 'V/krpm' });
    const response = await post(document).expect(422);
    expect(response.body.error.fields).toEqual([{ field: `results[${document.results.length - 1}].characteristic`, message: expect.stringContaining('waveforms[0]') }]);
    expect(await server.db('test_runs').count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it('when a stand posts the values only, then they are judged as posted and no waveform is stored', async () => {
    const document = runDocument(plant);
    document.results.push({ characteristic: 'ke', value: 51, unit: 'V/krpm' });
    const body = (await post(document).expect(201)).body;
    expect(valueOf(body, 'ke')).toMatchObject({ value: 51, verdict: 'fail' });
    expect(await server.db('waveforms').count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it('when one line is 5 % low (a weak magnet), then the NEMA MG 1 back-EMF unbalance fails', async () => {
    // Line RMS 48, 48, 45.6 → mean 47.2, largest deviation 1.6 → 3.39 % (NEMA MG 1 definition).
    const body = (await post(runDocument(plant, { waveforms: [spin({ lineScale: { wu: 0.95 } })] })).expect(201)).body;
    expect(valueOf(body, 'emf_unbalance')?.value).toBeCloseTo((100 * 1.6) / 47.2, 3);
    expect(valueOf(body, 'emf_unbalance')?.verdict).toBe('fail');
    expect(body.verdict).toBe('fail');
  });

  it('when two leads are exchanged, then the phase sequence reads −1 and fails, and the spacing is 120° off', async () => {
    const body = (await post(runDocument(plant, { waveforms: [spin({ reversed: true })] })).expect(201)).body;
    expect(valueOf(body, 'phase_sequence')).toMatchObject({ value: -1, verdict: 'fail' });
    expect(valueOf(body, 'phase_spacing_dev')?.value).toBeCloseTo(120, 3);
  });

  it('when a waveform holds less than two electrical cycles, then the run is refused with 422 naming the waveform', async () => {
    const response = await post(runDocument(plant, { waveforms: [spin({ samples: 400 })] })).expect(422);
    expect(response.body.error.fields).toEqual([{ field: 'waveforms[0]', message: expect.stringContaining('cycles') }]);
    expect(await server.db('test_runs').count({ n: '*' })).toEqual([{ n: 0 }]);
  });
});
