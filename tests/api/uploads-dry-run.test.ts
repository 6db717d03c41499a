import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { RunningServer } from '../../server/index.js';
import { startApiServer } from '../support/api-server.js';
import { truncateAll } from '../support/migrate.js';
import { signIn } from '../support/sign-in.js';
import { createPlant, nextSerial, type PlantFixture } from '../factories.js';
import { demoValues, longCsv, plantTime, postUpload, wideCsv, type RunSpec } from './uploads-support.js';

describe('result uploads: dry run', () => {
  let server: RunningServer;
  let quality: string;
  let plant: PlantFixture;
  const run = (minutesAgo: number, overrides: Record<string, number | string> = {}): RunSpec => ({
    serial: nextSerial(plant.product), startedAt: plantTime(minutesAgo), finishedAt: plantTime(minutesAgo - 4), values: demoValues(plant, overrides),
  });

  beforeAll(async () => {
    server = await startApiServer();
  });
  afterAll(async () => { await server.stop(); });
  beforeEach(async () => {
    await truncateAll(server.db);
    plant = await createPlant(server.db, { clientId: null });
    // Sessions live in the database, so sign in after it was emptied.
    quality = (await signIn(server.url, 'quality')).cookie;
  });

  it('when a semicolon CSV with decimal commas holds a bad number, then the report names its row and column and nothing is stored', async () => {
    const good = run(300);
    const bad = run(200, { 'bemf.ke': '12,3,4' });
    const csv = longCsv(plant, [good, bad], ';', ',');
    expect(csv).toContain(';21,02;'); // the file really is written with decimal commas
    const response = await postUpload(server.url, quality, { bytes: csv, name: 'offline-stand.csv' }, { format: 'long', delimiter: 'semicolon', decimal: ',' }).expect(201);
    // Header is row 1; each run has 7 rows; bemf.ke is the 5th characteristic of the second run.
    const badRow = 1 + 7 + 5;
    expect(response.body).toMatchObject({ status: 'dry-run', format: 'long', delimiter: ';', decimal: ',', rows: { total: 14, ok: 7, failed: 7 }, runs: { new: 1, invalid: 1, stored: 0 } });
    expect(response.body.problems).toEqual([{ row: badRow, column: 'value', message: "not a number '12,3,4' (decimal separator ',', no thousands separators)" }]);
    expect(response.body.runList).toMatchObject([
      { firstRow: 2, lastRow: 8, serial: good.serial, outcome: 'new', verdict: 'pass' },
      { firstRow: 9, lastRow: 15, serial: bad.serial, outcome: 'invalid', verdict: null },
    ]);
    expect(await server.db('test_runs').count({ n: '*' })).toEqual([{ n: 0 }]);
    expect(await server.db('motors').count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it('when a run breaks the ingest rules, then the dry run reports ingest\'s own finding on its row and column and judges the rest', async () => {
    const failing = run(300, { 'bemf.ke': 55.5 });
    const unknownLot = run(200);
    const rows = wideCsv(plant, [failing, unknownLot]).replace(`${unknownLot.serial},${plant.product.code},${plant.lot.code}`, `${unknownLot.serial},${plant.product.code},LOT-NOPE`);
    const response = await postUpload(server.url, quality, { bytes: rows, name: 'wide.csv' }, { format: 'wide' }).expect(201);
    expect(response.body.runs).toEqual({ new: 1, stored: 0, duplicate: 0, invalid: 1 });
    expect(response.body.runList.map((r: { verdict: string | null }) => r.verdict)).toEqual(['fail', null]);
    expect(response.body.problems).toEqual([{ row: 3, column: 'lot', message: 'lot LOT-NOPE is not known; lots are created before their motors are tested' }]);
    expect(await server.db('test_runs').count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it('when a wide cell holds a unit the product does not use, then the problem names the characteristic column', async () => {
    const csv = wideCsv(plant, [run(100)]).replace('bemf.ke [V/krpm]', 'bemf.ke [mV/rpm]');
    const response = await postUpload(server.url, quality, { bytes: csv, name: 'units.csv' }, { format: 'wide' }).expect(201);
    expect(response.body.problems).toEqual([{ row: 2, column: 'bemf.ke [mV/rpm]', message: 'bemf.ke is measured in V/krpm, not mV/rpm' }]);
  });

  it('when a date has no offset, then the row is refused with the expected form rather than read in some zone', async () => {
    const noOffset = run(100);
    noOffset.startedAt = noOffset.startedAt.slice(0, 19);
    const response = await postUpload(server.url, quality, { bytes: wideCsv(plant, [noOffset]), name: 'dates.csv' }, { format: 'wide' }).expect(201);
    expect(response.body.problems).toEqual([{ row: 2, column: 'startedAt', message: 'must be an ISO 8601 date-time with an offset, e.g. 2026-12-01T08:15:00+01:00' }]);
  });

  it('when the header has an unknown column or a quote is never closed, then the file is refused naming row and column', async () => {
    const header = await postUpload(server.url, quality, { bytes: 'serial,product,colour\r\nFT000001,X,red\r\n', name: 'odd.csv' }, { format: 'long' }).expect(422);
    expect(header.body.error.fields).toContainEqual({ field: 'row 1, column colour', message: expect.stringContaining('is not a column of the long format') });
    expect(header.body.error.fields).toContainEqual({ field: 'row 1, column station', message: 'is missing from the header row' });
    const broken = `${wideCsv(plant, [run(100)]).trimEnd()}\r\n"FT1,${plant.product.code}\r\n`;
    const syntax = await postUpload(server.url, quality, { bytes: broken, name: 'broken.csv' }, { format: 'wide' }).expect(422);
    expect(syntax.body.error.fields).toEqual([{ field: 'row 3, column 1', message: 'a quoted field is never closed' }]);
    expect(await server.db('uploads').count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it('when rows of one long-format run are split apart, then every place of that run is refused and the other run is judged', async () => {
    const a = run(300);
    const b = run(200);
    const lines = longCsv(plant, [a, b]).trimEnd().split('\r\n');
    const reordered = [lines[0], ...lines.slice(1, 4), ...lines.slice(8), ...lines.slice(4, 8)].join('\r\n');
    const response = await postUpload(server.url, quality, { bytes: reordered, name: 'split.csv' }, { format: 'long' }).expect(201);
    expect(response.body.runs).toMatchObject({ new: 1, invalid: 2 });
    const message = expect.stringContaining(`the run of serial ${a.serial} on ${plant.station.code} started ${a.startedAt} is given in more than one place (rows 2, 12)`);
    expect(response.body.problems).toEqual([{ row: 2, column: '(run)', message }, { row: 12, column: '(run)', message }]);
    expect(response.body.runList.map((r: { serial: string; outcome: string }) => [r.serial, r.outcome])).toEqual([[a.serial, 'invalid'], [b.serial, 'new'], [a.serial, 'invalid']]);
  });

  it('when an operator or an auditor uploads, commits or lists, then each is refused with 403', async () => {
    const csv = wideCsv(plant, [run(100)]);
    for (const login of ['operator', 'auditor']) {
      const { cookie } = await signIn(server.url, login);
      await postUpload(server.url, cookie, { bytes: csv, name: 'r.csv' }, { format: 'wide' }).expect(403);
      await request(server.url).get('/api/v1/uploads').set('cookie', cookie).expect(403);
      await request(server.url).post('/api/v1/uploads/1/commit').set('cookie', cookie).set('x-fluxtrail-csrf', '1').expect(403);
    }
    expect(await server.db('uploads').count({ n: '*' })).toEqual([{ n: 0 }]);
  });
});
