import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createServer } from 'node:net';
import { startApiServer } from '../support/api-server.js';
import { truncateAll } from '../support/migrate.js';
import { signIn } from '../support/sign-in.js';
import { testPorts } from '../support/ports.js';
import type { RunningServer } from '../../server/index.js';
import { startMailSink } from '../../mail-fake/index.js';
import { deliverPendingMail } from '../../server/jobs/mail-outbox.js';
import { smtpTransport } from '../../server/services/mail/transport.js';
import { ingestTestRun } from '../../server/services/runs/ingest-test-run.js';
import { subscribeToProduct } from '../../server/services/signals/subscriptions.js';
import { createPlant, runDocument, type PlantFixture } from '../factories.js';

const sinkApi = `http://127.0.0.1:${testPorts.mailWeb}/api/messages`;
type SinkMessage = { to: string[]; subject: string; text: string };
const sinkMessages = async (): Promise<SinkMessage[]> => (await fetch(sinkApi)).json() as Promise<SinkMessage[]>;

/** A loopback port with nothing listening on it: the relay is "down". */
async function freePort(): Promise<number> {
  const probe = createServer();
  await new Promise<void>((resolve) => probe.listen(0, '127.0.0.1', () => resolve()));
  const { port } = probe.address() as { port: number };
  await new Promise<void>((resolve) => probe.close(() => resolve()));
  return port;
}

describe('signal e-mail through the database outbox', () => {
  let server: RunningServer;
  let plant: PlantFixture;
  let quality: string;
  const ke = () => plant.product.characteristics.find((c) => c.code === 'bemf.ke')!.id;
  const post = (path: string, body: object = {}) => request(server.url).post(path).set('cookie', quality).set('x-fluxtrail-csrf', '1').send(body);
  const options = () => ({ from: server.config.smtp.from, publicUrl: server.config.publicUrl });

  async function ingest(value: number) {
    const doc = runDocument(plant);
    doc.results = doc.results.map((r) => (r.characteristic === 'bemf.ke' ? { ...r, value } : r));
    await ingestTestRun(server.db, doc);
  }
  async function openOneSignal(): Promise<number> {
    for (let i = 0; i < 100; i++) await ingest(i % 2 === 0 ? 49.9 : 50.1);
    const trial = await post(`/api/v1/spc/characteristics/${ke()}/trial-limits`, { chartKind: 'individuals' }).expect(201);
    await post(`/api/v1/spc/control-limits/${trial.body.id}/freeze`).expect(200);
    await ingest(51);
    const [signal] = await server.db('signals').select('id');
    return signal.id;
  }

  beforeAll(async () => { server = await startApiServer(); });
  afterAll(async () => { await server.stop(); });
  beforeEach(async () => {
    await truncateAll(server.db);
    await fetch(sinkApi, { method: 'DELETE' });
    plant = await createPlant(server.db);
    quality = (await signIn(server.url, 'quality')).cookie;
  });

  it('when a signal opens for a subscribed product, then the subscriber gets an e-mail over SMTP linking to it', async () => {
    await request(server.url).put(`/api/v1/signals/subscriptions/${plant.product.code}`).set('cookie', quality).set('x-fluxtrail-csrf', '1').expect(200);
    await subscribeToProduct(server.db, { subject: 'someone-else', email: 'quality2@plant.example', productCode: plant.product.code });
    const signalId = await openOneSignal();
    expect(await server.db('mail_outbox').where({ status: 'pending' }).count({ n: '*' })).toEqual([{ n: 2 }]);
    const transport = smtpTransport(server.config.smtp);
    try {
      expect(await deliverPendingMail(server.db, transport, options())).toEqual({ sent: 2, failed: 0 });
    } finally { transport.close(); }
    const messages = await sinkMessages();
    expect(messages.map((m) => m.to[0]).sort()).toEqual(['quality2@plant.example', 'quality@plant.example']);
    expect(messages[0].subject).toContain(`Signal ${signalId} opened`);
    expect(messages[0].text).toContain(`${server.config.publicUrl}/signals/${signalId}`);
  });

  it('when the SMTP relay is down, then the message waits with its error and is sent exactly once when the relay is back', async () => {
    await subscribeToProduct(server.db, { subject: 'q', email: 'quality@plant.example', productCode: plant.product.code });
    await openOneSignal();
    const port = await freePort();
    const transport = smtpTransport({ ...server.config.smtp, port });
    try {
      expect(await deliverPendingMail(server.db, transport, options())).toEqual({ sent: 0, failed: 1 });
      const waiting = await server.db('mail_outbox').first();
      expect(waiting).toMatchObject({ status: 'pending', attempts: 1 });
      expect(waiting.last_error).toMatch(/ECONNREFUSED/);
      expect(waiting.next_attempt_at.getTime()).toBeGreaterThan(Date.now());

      const sink = await startMailSink({ smtpPort: port, webPort: 0 });
      try {
        const later = { ...options(), now: new Date(Date.now() + 60 * 60_000) };
        // Two senders at once (two app processes): SKIP LOCKED lets only one of them have the row.
        const reports = await Promise.all([deliverPendingMail(server.db, transport, later), deliverPendingMail(server.db, transport, later)]);
        expect(reports.reduce((sum, r) => sum + r.sent, 0)).toBe(1);
        expect(await deliverPendingMail(server.db, transport, later)).toEqual({ sent: 0, failed: 0 });
        expect(sink.messages()).toHaveLength(1);
        expect(await server.db('mail_outbox').first()).toMatchObject({ status: 'sent', attempts: 2, last_error: null });
      } finally { await sink.close(); }
    } finally { transport.close(); }
  });
});
