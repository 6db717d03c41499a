import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import type { RunningServer } from '../../server/index.js';
import { claimNextExportJob, failInterruptedExportJobs, interruptedReason, runExportJob } from '../../server/jobs/export-jobs.js';
import { startJobs } from '../../server/jobs/start-jobs.js';
import { startApiServer } from '../support/api-server.js';
import { seedPlant, signedIn, type Agent } from './evidence-seed.js';

describe('evidence pack jobs', () => {
  let server: RunningServer;
  let auditor: Agent;
  const packsDir = () => join(server.config.dataDir, 'evidence-packs');
  const queue = async (body: object = { product: 'PM-150' }) => (await auditor.post('/api/v1/evidence-packs', body).expect(202)).body.id as number;
  const drainQueue = async () => { await server.db('export_jobs').whereIn('status', ['queued', 'running']).update({ status: 'cancelled' }); };

  beforeAll(async () => {
    server = await startApiServer();
    await seedPlant(server.db);
    auditor = await signedIn(server.url, 'auditor');
  });
  afterAll(async () => { await server.stop(); });

  it('when a queued pack is cancelled, then it is cancelled at once and no worker claims it', async () => {
    await drainQueue();
    const id = await queue();
    const cancelled = await auditor.post(`/api/v1/evidence-packs/${id}/cancel`).expect(200);
    expect(cancelled.body).toMatchObject({ id, status: 'cancelled' });
    expect(await claimNextExportJob(server.db, 'w1')).toBeUndefined();
    await auditor.post(`/api/v1/evidence-packs/${id}/cancel`).expect(409);
    await auditor.get(`/api/v1/evidence-packs/${id}/download`).expect(409);
  });

  it('when a running pack is cancelled, then the job stops at its next page and leaves no file', async () => {
    await drainQueue();
    const id = await queue();
    const job = await claimNextExportJob(server.db, 'w1');
    expect(job?.id).toBe(id);
    const asked = await auditor.post(`/api/v1/evidence-packs/${id}/cancel`).expect(200);
    expect(asked.body).toMatchObject({ status: 'running', cancelRequested: true });
    expect(await runExportJob(server.db, job!, { dataDir: server.config.dataDir })).toBe('cancelled');
    const after = await auditor.get(`/api/v1/evidence-packs/${id}`).expect(200);
    expect(after.body).toMatchObject({ status: 'cancelled', sha256: null });
    expect(readdirSync(packsDir()).filter((n) => n.startsWith(`evidence-pack-${id}-`) || n.startsWith(`work-${id}-`))).toEqual([]);
  });

  it('when a running job has a stale heartbeat, then start-up marks it failed with the reason and spares a live one', async () => {
    await drainQueue();
    const stale = await queue();
    const live = await queue();
    const first = await claimNextExportJob(server.db, 'dead-process');
    const second = await claimNextExportJob(server.db, 'live-process');
    expect([first?.id, second?.id]).toEqual([stale, live]);
    await server.db('export_jobs').where({ id: stale }).update({ heartbeat_at: server.db.raw('NOW(3) - INTERVAL 10 MINUTE') });
    expect(await failInterruptedExportJobs(server.db, server.config.dataDir, 60)).toEqual([stale]);
    const failed = await auditor.get(`/api/v1/evidence-packs/${stale}`).expect(200);
    expect(failed.body).toMatchObject({ status: 'failed', error: interruptedReason });
    expect((await auditor.get(`/api/v1/evidence-packs/${live}`).expect(200)).body.status).toBe('running');
  });

  it('when two workers claim at the same moment, then SKIP LOCKED gives each a different job', async () => {
    await drainQueue();
    const ids = [await queue(), await queue()];
    const claims = await Promise.all([claimNextExportJob(server.db, 'a'), claimNextExportJob(server.db, 'b'), claimNextExportJob(server.db, 'c')]);
    const claimed = claims.filter((c) => c !== undefined).map((c) => c!.id).sort((x, y) => x - y);
    expect(claimed).toEqual(ids);
  });

  it('when the job loop runs, then a queued pack is built in the background and listed with its hash and size', async () => {
    await drainQueue();
    const id = await queue({ serialFrom: 'PM150-0002', serialTo: 'PM150-0004' });
    const jobs = startJobs({ db: server.db, config: server.config, pollMs: 50 });
    try {
      let view: { status: string; progress: number; rows: number; rowsTotal: number | null; sha256: string | null } | undefined;
      for (let i = 0; i < 100 && view?.status !== 'done'; i++) {
        await new Promise((r) => setTimeout(r, 100));
        view = (await auditor.get(`/api/v1/evidence-packs/${id}`).expect(200)).body;
      }
      expect(view).toMatchObject({ status: 'done', progress: 1 });
      expect(view!.rows).toBe(view!.rowsTotal);
      expect(view!.sha256).toMatch(/^[0-9a-f]{64}$/);
    } finally {
      await jobs.stop();
    }
    const list = await auditor.get('/api/v1/evidence-packs?limit=2').expect(200);
    expect(list.body.items[0]).toMatchObject({ id, status: 'done', requestedBy: { name: 'Helen Marsh', role: 'auditor' }, filter: { serialFrom: 'PM150-0002', serialTo: 'PM150-0004' } });
    expect(list.body.items[0].sizeBytes).toBeGreaterThan(0);
    expect(list.body.nextCursor).not.toBeNull();
    const row = await server.db('export_jobs').where({ id }).first();
    expect(existsSync(join(server.config.dataDir, row.file_key))).toBe(true);
  });

  it('when the filter is wrong, then 422 names the field and nothing is queued', async () => {
    const before = await server.db('export_jobs').count({ n: '*' }).first();
    const half = await auditor.post('/api/v1/evidence-packs', { serialFrom: 'PM150-0001' }).expect(422);
    expect(half.body.error.fields.map((f: { field: string }) => f.field)).toContain('serialTo');
    const unknown = await auditor.post('/api/v1/evidence-packs', { lots: ['LOT-A', 'LOT-NOPE'] }).expect(422);
    expect(unknown.body.error.fields).toEqual([{ field: 'lots[1]', message: 'no lot with code LOT-NOPE' }]);
    const empty = await auditor.post('/api/v1/evidence-packs', {}).expect(422);
    expect(empty.body.error.fields[0].message).toMatch(/at least one/);
    const badDate = await auditor.post('/api/v1/evidence-packs', { from: 'last week' }).expect(422);
    expect(badDate.body.error.fields[0].field).toBe('from');
    expect(await server.db('export_jobs').count({ n: '*' }).first()).toEqual(before);
  });

  it('when operator or manager ask to create or download a pack, then 403; quality and admin may create', async () => {
    const done = await server.db('export_jobs').where({ status: 'done' }).first('id');
    for (const login of ['operator', 'manager']) {
      const agent = await signedIn(server.url, login);
      await agent.post('/api/v1/evidence-packs', { product: 'PM-150' }).expect(403);
      await agent.get(`/api/v1/evidence-packs/${done.id}/download`).expect(403);
      await agent.get('/api/v1/evidence-packs').expect(403);
    }
    for (const login of ['quality', 'admin']) {
      const agent = await signedIn(server.url, login);
      await agent.post('/api/v1/evidence-packs', { product: 'PM-150' }).expect(202);
      await agent.get(`/api/v1/evidence-packs/${done.id}/download`).expect(200);
    }
  });
});
