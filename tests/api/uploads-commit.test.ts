import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { RunningServer } from '../../server/index.js';
import { startApiServer } from '../support/api-server.js';
import { truncateAll } from '../support/migrate.js';
import { signIn } from '../support/sign-in.js';
import { createPlant, nextSerial, type PlantFixture } from '../factories.js';
import { uploadListSchema } from '../../server/openapi/upload-response-schemas.js';
import { commitAndWait, demoValues, longCsv, plantTime, postUpload, wideCsv, wideXlsx, type RunSpec } from './uploads-support.js';

describe('result uploads: commit', () => {
  let server: RunningServer;
  let quality: string;
  let plant: PlantFixture;
  const run = (minutesAgo: number, overrides: Record<string, number | string> = {}): RunSpec => ({
    serial: nextSerial(plant.product), startedAt: plantTime(minutesAgo), finishedAt: plantTime(minutesAgo - 4), values: demoValues(plant, overrides),
  });
  const storedRuns = () => server.db('test_runs').join('motors', 'motors.id', 'test_runs.motor_id')
    .orderBy('test_runs.started_at').select('motors.serial', 'test_runs.verdict', 'test_runs.source', 'test_runs.run_uuid');

  beforeAll(async () => {
    server = await startApiServer();
  });
  afterAll(async () => { await server.stop(); });
  beforeEach(async () => {
    await truncateAll(server.db);
    plant = await createPlant(server.db, { clientId: null });
    quality = (await signIn(server.url, 'quality')).cookie;
  });

  it('when a wide XLSX is committed, then its runs are stored with their verdicts, linked to the upload and audited', async () => {
    const runs = [run(400), run(300, { 'bemf.ke': 53.1 }), run(200)];
    const dry = await postUpload(server.url, quality, { bytes: await wideXlsx(plant, runs), name: 'week-48.xlsx' }, { format: 'wide' }).expect(201);
    expect(dry.body).toMatchObject({ fileType: 'xlsx', status: 'dry-run', runs: { new: 3, invalid: 0 }, problems: [] });
    expect(await server.db('test_runs').count({ n: '*' })).toEqual([{ n: 0 }]);

    const { started, view } = await commitAndWait(server.url, quality, dry.body.id);
    expect(started.status).toBe(202);
    expect(view).toMatchObject({ status: 'committed', progress: 1, committedBy: 'Piet Lindqvist', rows: { total: 3, ok: 3, failed: 0 }, runs: { stored: 3, duplicate: 0, invalid: 0 } });
    const stored = await storedRuns();
    expect(stored.map((r) => [r.serial, r.verdict, r.source])).toEqual([[runs[0].serial, 'pass', 'upload'], [runs[1].serial, 'fail', 'upload'], [runs[2].serial, 'pass', 'upload']]);
    const bemf = await server.db('measurements').join('characteristics', 'characteristics.id', 'measurements.characteristic_id')
      .where('characteristics.code', 'bemf.ke').orderBy('measurements.run_id').pluck('value');
    expect(bemf).toEqual([50.3, 53.1, 50.3]);
    const links = await server.db('upload_runs').where({ upload_id: dry.body.id }).orderBy('first_row').pluck('run_uuid');
    expect(links).toEqual(stored.map((r) => r.run_uuid));
    const audit = await server.db('audit_events').where({ action: 'upload.commit', entity_id: String(dry.body.id) }).first('actor', 'after_json');
    expect(audit.actor).toBe('Piet Lindqvist');
    expect(typeof audit.after_json === 'string' ? JSON.parse(audit.after_json) : audit.after_json).toMatchObject({ fileName: 'week-48.xlsx', fileSha256: dry.body.fileSha256, runsStored: 3 });
  });

  it('when the same file is committed again, then the earlier result answers and nothing is stored twice', async () => {
    const file = { bytes: await wideXlsx(plant, [run(400), run(300)]), name: 'again.xlsx' };
    const first = await postUpload(server.url, quality, file, { format: 'wide' }).expect(201);
    await commitAndWait(server.url, quality, first.body.id);
    const again = await postUpload(server.url, quality, { ...file, name: 'renamed.xlsx' }, { format: 'wide' }).expect(200);
    expect(again.body).toMatchObject({ id: first.body.id, status: 'committed', fileName: 'again.xlsx', runs: { stored: 2 } });
    const recommit = await request(server.url).post(`/api/v1/uploads/${first.body.id}/commit`).set('cookie', quality).set('x-fluxtrail-csrf', '1').expect(200);
    expect(recommit.body).toMatchObject({ status: 'committed', runs: { stored: 2 } });
    expect(await server.db('test_runs').count({ n: '*' })).toEqual([{ n: 2 }]);
    expect(await server.db('measurements').count({ n: '*' })).toEqual([{ n: 14 }]);
    expect(await server.db('uploads').count({ n: '*' })).toEqual([{ n: 1 }]);
    expect(await server.db('audit_events').where({ action: 'upload.commit' }).count({ n: '*' })).toEqual([{ n: 1 }]);
  });

  it('when the same runs come again in another file and layout, then the dry run calls them duplicates and the commit skips them', async () => {
    const runs = [run(400), run(300)];
    const wide = await postUpload(server.url, quality, { bytes: wideCsv(plant, runs), name: 'wide.csv' }, { format: 'wide' }).expect(201);
    await commitAndWait(server.url, quality, wide.body.id);
    const long = await postUpload(server.url, quality, { bytes: longCsv(plant, [...runs, run(100)], '\t', ','), name: 'long.tsv' }, { format: 'long', delimiter: 'tab', decimal: ',' }).expect(201);
    expect(long.body.runs).toEqual({ new: 1, stored: 0, duplicate: 2, invalid: 0 });
    const { view } = await commitAndWait(server.url, quality, long.body.id);
    expect(view.runs).toEqual({ new: 0, stored: 1, duplicate: 2, invalid: 0 });
    expect(await server.db('test_runs').count({ n: '*' })).toEqual([{ n: 3 }]);
  });

  it('when one run of a file is invalid, then the valid runs are stored and the invalid one is reported and not stored', async () => {
    const runs = [run(400), { ...run(300), serial: 'XX-not-a-serial' }, run(200)];
    const dry = await postUpload(server.url, quality, { bytes: wideCsv(plant, runs), name: 'mixed.csv' }, { format: 'wide' }).expect(201);
    expect(dry.body.runs).toEqual({ new: 2, stored: 0, duplicate: 0, invalid: 1 });
    const { view } = await commitAndWait(server.url, quality, dry.body.id);
    expect(view).toMatchObject({ status: 'committed', rows: { total: 3, ok: 2, failed: 1 }, runs: { stored: 2, invalid: 1 } });
    expect(view.problems).toEqual([{ row: 3, column: 'serial', message: `does not match the serial pattern of product ${plant.product.code}` }]);
    expect((await storedRuns()).map((r) => r.serial)).toEqual([runs[0].serial, runs[2].serial]);
    expect(await server.db('motors').where({ serial: 'XX-not-a-serial' }).first()).toBeUndefined();
    const list = await request(server.url).get('/api/v1/uploads').set('cookie', quality).expect(200);
    uploadListSchema.strict().parse(list.body);
    expect(list.body.items).toMatchObject([{ id: dry.body.id, fileName: 'mixed.csv', status: 'committed', runs: { stored: 2, invalid: 1 } }]);
  });

  it('when a stored run comes again with other values, then it is refused as a conflict and the stored values stay', async () => {
    const original = run(400);
    const first = await postUpload(server.url, quality, { bytes: wideCsv(plant, [original]), name: 'a.csv' }, { format: 'wide' }).expect(201);
    await commitAndWait(server.url, quality, first.body.id);
    const changed = { ...original, values: demoValues(plant, { 'bemf.ke': 49.9 }) };
    const second = await postUpload(server.url, quality, { bytes: wideCsv(plant, [changed]), name: 'b.csv' }, { format: 'wide' }).expect(201);
    expect(second.body.problems).toEqual([{ row: 2, column: '(run)', message: expect.stringContaining('is stored already with other values') }]);
    const { view } = await commitAndWait(server.url, quality, second.body.id);
    expect(view.runs).toMatchObject({ stored: 0, invalid: 1 });
    const bemf = await server.db('measurements').join('characteristics', 'characteristics.id', 'measurements.characteristic_id').where('characteristics.code', 'bemf.ke').pluck('value');
    expect(bemf).toEqual([50.3]);
  });

  it('when an upload does not exist, then reading or committing it answers 404', async () => {
    await request(server.url).post('/api/v1/uploads/999/commit').set('cookie', quality).set('x-fluxtrail-csrf', '1').expect(404);
    await request(server.url).get('/api/v1/uploads/999').set('cookie', quality).expect(404);
  });
});
