import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import { rm } from 'node:fs/promises';
import type { RunningServer } from '../../server/index.js';
import { startJobs } from '../../server/jobs/start-jobs.js';
import { resumeInterruptedUploads, uploadFileGoneReason } from '../../server/jobs/upload-passes.js';
import { stopUploadPasses } from '../../server/services/uploads/finish-upload-pass.js';
import { storedFile } from '../../server/services/uploads/receive-upload.js';
import { startApiServer } from '../support/api-server.js';
import { truncateAll } from '../support/migrate.js';
import { signIn } from '../support/sign-in.js';
import { createPlant, nextSerial, type PlantFixture } from '../factories.js';
import { demoValues, expectReport, plantTime, postUpload, wideCsv, type RunSpec } from './uploads-support.js';

// A commit is stored in chunks of 100 runs. Interrupted after the first chunk (a shutdown stops a
// pass after the chunk it is in, which makes the cut exact), it must be taken up again by the
// next process, not left "committing": the runs stored stay stored once, the rest follow.
describe('result uploads: a commit interrupted by a restart', () => {
  let server: RunningServer;
  let quality: string;
  let plant: PlantFixture;
  const upload = (id: number) => server.db('uploads').where({ id }).first();
  const commitAudits = (id: number) => server.db('audit_events').where({ action: 'upload.commit', entity_id: String(id) }).select('actor', 'actor_role');

  beforeAll(async () => { server = await startApiServer(); });
  afterAll(async () => { await server.stop(); });
  beforeEach(async () => {
    await truncateAll(server.db);
    plant = await createPlant(server.db, { clientId: null });
    quality = (await signIn(server.url, 'quality')).cookie;
  });

  /** A dry-run upload of `count` runs, committed and then cut off after its first chunk. */
  async function interruptedCommit(count: number, name: string): Promise<number> {
    const runs: RunSpec[] = Array.from({ length: count }, (_, i) => ({
      serial: nextSerial(plant.product), startedAt: plantTime(2000 - i * 5), finishedAt: plantTime(1996 - i * 5), values: demoValues(plant),
    }));
    const dry = await postUpload(server.url, quality, { bytes: wideCsv(plant, runs), name }, { format: 'wide' }).expect(201);
    await request(server.url).post(`/api/v1/uploads/${dry.body.id}/commit`).set('cookie', quality).set('x-fluxtrail-csrf', '1').expect(202);
    await stopUploadPasses();
    return dry.body.id;
  }

  async function waitUntilEnded(id: number) {
    for (let i = 0; i < 600; i++) {
      const row = await upload(id);
      if (row.status === 'committed' || row.status === 'failed') return row;
      await new Promise((r) => setTimeout(r, 50));
    }
    throw new Error(`upload ${id} did not end`);
  }

  it('when the app shuts down mid-commit, then the upload is handed back, and the next start commits the rest once', async () => {
    const id = await interruptedCommit(150, 'shutdown.csv');
    const handedBack = await upload(id);
    expect(handedBack).toMatchObject({ status: 'committing', heartbeat_at: null, runs_stored: 0 });
    expect(handedBack.progress).toBeGreaterThan(0.6);
    expect(handedBack.progress).toBeLessThan(0.7);
    expect(await server.db('test_runs').count({ n: '*' })).toEqual([{ n: 100 }]);
    expect(await commitAudits(id)).toEqual([]);
    const view = await request(server.url).get(`/api/v1/uploads/${id}`).set('cookie', quality).expect(200).expect(expectReport);
    expect(view.body.status).toBe('committing');

    const jobs = startJobs({ db: server.db, config: server.config, pollMs: 50 });
    try {
      expect(await waitUntilEnded(id)).toMatchObject({ status: 'committed', runs_stored: 150, runs_duplicate: 0, progress: 1 });
    } finally {
      await jobs.stop();
    }
    expect(await server.db('test_runs').countDistinct({ n: 'run_uuid' })).toEqual([{ n: 150 }]);
    expect(await server.db('test_runs').count({ n: '*' })).toEqual([{ n: 150 }]);
    expect(await server.db('upload_runs').where({ upload_id: id, outcome: 'stored' }).count({ n: '*' })).toEqual([{ n: 150 }]);
    expect(await commitAudits(id)).toEqual([{ actor: 'Piet Lindqvist', actor_role: 'quality' }]);
  });

  it('when the process died mid-commit, then the stale commit is taken up and a live one elsewhere is left alone', async () => {
    const died = await interruptedCommit(120, 'crash.csv');
    // A killed process hands nothing back: its last heartbeat simply grows old.
    await server.db('uploads').where({ id: died }).update({ heartbeat_at: new Date(Date.now() - 10 * 60_000) });
    const live = (await postUpload(server.url, quality, { bytes: wideCsv(plant, []), name: 'live.csv' }, { format: 'wide' }).expect(201)).body.id;
    const liveBeat = new Date(Date.now() - 30_000);
    await server.db('uploads').where({ id: live }).update({ status: 'committing', heartbeat_at: liveBeat });

    expect(await resumeInterruptedUploads(server.db, server.config.dataDir)).toEqual({ resumed: [died], failed: [] });
    expect(await resumeInterruptedUploads(server.db, server.config.dataDir)).toEqual({ resumed: [], failed: [] });
    expect(await waitUntilEnded(died)).toMatchObject({ status: 'committed', runs_stored: 120 });
    expect(await server.db('test_runs').count({ n: '*' })).toEqual([{ n: 120 }]);
    expect(await commitAudits(died)).toHaveLength(1);
    expect(await upload(live)).toMatchObject({ status: 'committing', heartbeat_at: liveBeat });
  });

  it('when the file is sent again while its commit waits to be taken up, then the upload answers as it is and is not checked afresh', async () => {
    const runs: RunSpec[] = Array.from({ length: 110 }, (_, i) => ({
      serial: nextSerial(plant.product), startedAt: plantTime(2000 - i * 5), finishedAt: plantTime(1996 - i * 5), values: demoValues(plant),
    }));
    const file = { bytes: wideCsv(plant, runs), name: 'again.csv' };
    const id = (await postUpload(server.url, quality, file, { format: 'wide' }).expect(201)).body.id;
    await request(server.url).post(`/api/v1/uploads/${id}/commit`).set('cookie', quality).set('x-fluxtrail-csrf', '1').expect(202);
    await stopUploadPasses();
    const again = await postUpload(server.url, quality, file, { format: 'wide' }).expect(200);
    expect(again.body).toMatchObject({ id, status: 'committing' });
    expect(await server.db('upload_runs').where({ upload_id: id, outcome: 'stored' }).count({ n: '*' })).toEqual([{ n: 100 }]);
  });

  it('when the stored file of an interrupted commit is gone, then the upload is marked failed with the reason', async () => {
    const id = await interruptedCommit(101, 'gone.csv');
    await rm(storedFile(server.config.dataDir, await upload(id)).path);
    expect(await resumeInterruptedUploads(server.db, server.config.dataDir)).toEqual({ resumed: [], failed: [id] });
    const view = await request(server.url).get(`/api/v1/uploads/${id}`).set('cookie', quality).expect(200).expect(expectReport);
    expect(view.body).toMatchObject({ status: 'failed', error: uploadFileGoneReason });
    expect(await server.db('test_runs').count({ n: '*' })).toEqual([{ n: 100 }]);
  });
});
