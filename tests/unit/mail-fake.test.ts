import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import nodemailer from 'nodemailer';
import { startMailSink } from '../../mail-fake/index.js';
import type { RunningMailSink, StoredMessage } from '../../mail-fake/index.js';

let sink: RunningMailSink;
let webBase: string;

beforeAll(async () => {
  sink = await startMailSink({ smtpPort: 0, webPort: 0 });
  webBase = `http://127.0.0.1:${sink.webPort}`;
});
afterAll(async () => {
  await sink.close();
});
beforeEach(async () => {
  await fetch(`${webBase}/api/messages`, { method: 'DELETE' });
});

async function send(message: { to: string; subject: string; text: string; html?: string }): Promise<void> {
  const transport = nodemailer.createTransport({ host: '127.0.0.1', port: sink.smtpPort, secure: false, ignoreTLS: true });
  await transport.sendMail({ from: 'Fluxtrail <noreply@plant.example>', ...message });
  transport.close();
}

async function listed(): Promise<StoredMessage[]> {
  const response = await fetch(`${webBase}/api/messages`);
  expect(response.status).toBe(200);
  return (await response.json()) as StoredMessage[];
}

describe('mail-fake', () => {
  it('when a message is sent over SMTP, then GET /api/messages returns it parsed', async () => {
    await send({
      to: 'quality@plant.example',
      subject: 'Hold placed on lot L-0042',
      text: 'Lot L-0042 is on hold.',
      html: '<p>Lot <b>L-0042</b> is on hold.</p>',
    });
    const [message] = await listed();
    expect(message.id).toEqual(expect.any(Number));
    expect(Date.parse(message.receivedAt)).not.toBeNaN();
    expect(message.from).toContain('noreply@plant.example');
    expect(message.to).toEqual(['quality@plant.example']);
    expect(message.subject).toBe('Hold placed on lot L-0042');
    expect(message.text.trim()).toBe('Lot L-0042 is on hold.');
    expect(message.html).toContain('<b>L-0042</b>');
  });

  it('when two messages arrive, then the most recent is listed first', async () => {
    await send({ to: 'auditor@plant.example', subject: 'first', text: 'one' });
    await send({ to: 'manager@plant.example', subject: 'second', text: 'two' });
    expect((await listed()).map((message) => message.subject)).toEqual(['second', 'first']);
    expect(sink.messages().map((message) => message.subject)).toEqual(['second', 'first']);
  });

  it('when DELETE /api/messages is called, then the inbox is empty', async () => {
    await send({ to: 'admin@plant.example', subject: 'to be cleared', text: 'x' });
    const response = await fetch(`${webBase}/api/messages`, { method: 'DELETE' });
    expect(response.status).toBe(204);
    expect(await listed()).toEqual([]);
  });

  it('when the inbox and a message are viewed, then subject and text are shown escaped', async () => {
    await send({ to: 'operator@plant.example', subject: 'Signal <script>x</script>', text: 'Reading <b>42</b> & rising' });
    const [message] = await listed();

    const inbox = await (await fetch(`${webBase}/`)).text();
    expect(inbox).toContain('operator@plant.example');
    expect(inbox).toContain('Signal &lt;script&gt;x&lt;/script&gt;');
    expect(inbox).not.toContain('<script>x</script>');
    expect(inbox).toContain(`href="/messages/${message.id}"`);

    const page = await fetch(`${webBase}/messages/${message.id}`);
    expect(page.headers.get('content-security-policy')).toContain("default-src 'none'");
    expect(await page.text()).toContain('Reading &lt;b&gt;42&lt;/b&gt; &amp; rising');
  });

  it('when an unknown message id is asked for, then the API answers 404', async () => {
    expect((await fetch(`${webBase}/api/messages/999999`)).status).toBe(404);
  });
});

describe('mail-fake start-up', () => {
  it('when the SMTP port is already taken, then startMailSink rejects instead of crashing', async () => {
    await expect(startMailSink({ smtpPort: sink.smtpPort, webPort: 0 })).rejects.toThrow(/EADDRINUSE/);
  });
});
