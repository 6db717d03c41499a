import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startApiServer } from '../support/api-server.js';
import { truncateAll } from '../support/migrate.js';
import { signIn } from '../support/sign-in.js';
import type { RunningServer } from '../../server/index.js';
import { ingestTestRun } from '../../server/services/runs/ingest-test-run.js';
import { createPlant, runDocument, type PlantFixture } from '../factories.js';

describe('holds: one active hold per target and kind', () => {
  let server: RunningServer;
  let plant: PlantFixture;
  let quality: string;
  const write = (path: string, body: object) => request(server.url).post(path).set('cookie', quality).set('x-fluxtrail-csrf', '1').send(body);
  const activeHolds = (where: object) => server.db('holds').where(where).whereNull('released_at').select('id', 'kind', 'reason');

  beforeAll(async () => { server = await startApiServer(); });
  afterAll(async () => { await server.stop(); });
  beforeEach(async () => {
    await truncateAll(server.db);
    quality = (await signIn(server.url, 'quality')).cookie;
    plant = await createPlant(server.db);
  });

  it('when a lot already has an active manual hold, then a second answers 409 naming code, and nothing is written', async () => {
    const first = await write(`/api/v1/lots/${plant.lot.code}/holds`, { reason: 'Magnet lot under investigation' }).expect(201);
    const auditBefore = await server.db('audit_events').count({ n: '*' });
    const second = await write(`/api/v1/lots/${plant.lot.code}/holds`, { reason: 'Same lot, second engineer' }).expect(409);
    expect(second.body.error.code).toBe('conflict');
    expect(second.body.error.fields).toEqual([{ field: 'code', message: `already on an active manual hold (hold ${first.body.id})` }]);
    expect(second.body.error.message).toContain('Magnet lot under investigation');
    expect(await activeHolds({ lot_id: plant.lot.id })).toEqual([{ id: first.body.id, kind: 'manual', reason: 'Magnet lot under investigation' }]);
    expect(await server.db('audit_events').count({ n: '*' })).toEqual(auditBefore);
  });

  it('when the first hold is released, then the target can be held again', async () => {
    const first = await write(`/api/v1/lots/${plant.lot.code}/holds`, { reason: 'First containment' }).expect(201);
    await write(`/api/v1/holds/${first.body.id}/release`, { reason: 'Cleared' }).expect(200);
    const again = await write(`/api/v1/lots/${plant.lot.code}/holds`, { reason: 'Second containment' }).expect(201);
    expect(await activeHolds({ lot_id: plant.lot.id })).toEqual([{ id: again.body.id, kind: 'manual', reason: 'Second containment' }]);
  });

  it('when two manual holds of one motor race, then one is placed and the other answers 409 naming serial', async () => {
    const document = runDocument(plant);
    await ingestTestRun(server.db, document);
    const responses = await Promise.all([
      write(`/api/v1/motors/${document.serial}/holds`, { reason: 'Noise at 3000 rpm' }),
      write(`/api/v1/motors/${document.serial}/holds`, { reason: 'Noise at 3000 rpm, reported twice' }),
    ]);
    expect(responses.map((r) => r.status).sort()).toEqual([201, 409]);
    expect(responses.find((r) => r.status === 409)?.body.error.fields[0].field).toBe('serial');
    const motor = await server.db('motors').where({ serial: document.serial }).first('id', 'status');
    expect(motor.status).toBe('on hold');
    expect(await activeHolds({ motor_id: motor.id })).toHaveLength(1);
    expect(await server.db('audit_events').where({ action: 'hold.placed' }).count({ n: '*' })).toEqual([{ n: 1 }]);
  });

  it('when a second active hold of the same kind is written past the service, then the database refuses it', async () => {
    const row = { lot_id: plant.lot.id, kind: 'manual', reason: 'direct', placed_by: 'test', placed_at: new Date() };
    await server.db('holds').insert(row);
    await expect(server.db('holds').insert(row)).rejects.toMatchObject({ code: 'ER_DUP_ENTRY' });
    // Other kinds, other signals and released holds do not collide.
    await server.db('holds').insert({ ...row, kind: 'signal', signal_id: 1 });
    await server.db('holds').insert({ ...row, kind: 'signal', signal_id: 2 });
    await server.db('holds').insert({ ...row, released_at: new Date(), released_by: 'test', release_reason: 'done' });
    expect(await server.db('holds').count({ n: '*' })).toEqual([{ n: 4 }]);
  });

  it('when duplicate active holds exist before the migration, then it keeps the oldest and releases the rest, audited', async () => {
    const migration = '20261202000100_holds_one_active.ts';
    await server.db.migrate.down({ name: migration });
    try {
      const row = { lot_id: plant.lot.id, kind: 'manual', reason: 'twice', placed_by: 'quality', placed_at: new Date() };
      const [kept] = await server.db('holds').insert(row);
      const [duplicate] = await server.db('holds').insert(row);
      const [otherKind] = await server.db('holds').insert({ ...row, kind: 'calibration' });
      await server.db.migrate.up({ name: migration });
      expect(await activeHolds({ lot_id: plant.lot.id }).orderBy('id')).toEqual([
        { id: kept, kind: 'manual', reason: 'twice' }, { id: otherKind, kind: 'calibration', reason: 'twice' },
      ]);
      expect(await server.db('holds').where({ id: duplicate }).first()).toMatchObject({ released_by: 'Fluxtrail migration' });
      const audit = await server.db('audit_events').where({ action: 'hold.released' }).select('entity_type', 'entity_id', 'after_json');
      expect(audit).toEqual([{ entity_type: 'lot', entity_id: plant.lot.code, after_json: { holdId: duplicate, keptHoldId: kept, released: true } }]);
      await request(server.url).get('/api/v1/audit/verify').set('cookie', (await signIn(server.url, 'auditor')).cookie).expect(200)
        .expect((response) => expect(response.body).toMatchObject({ ok: true }));
    } finally {
      await server.db.migrate.latest();
    }
  });

  it('when a motor on a manual hold is held by its lot too, then both holds stand (different targets)', async () => {
    const document = runDocument(plant);
    await ingestTestRun(server.db, document);
    await write(`/api/v1/motors/${document.serial}/holds`, { reason: 'Noise at 3000 rpm' }).expect(201);
    await write(`/api/v1/lots/${plant.lot.code}/holds`, { reason: 'Lot containment' }).expect(201);
    expect(await server.db('holds').whereNull('released_at').count({ n: '*' })).toEqual([{ n: 2 }]);
  });
});
