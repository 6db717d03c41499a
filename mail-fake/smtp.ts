import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { SMTPServerAddress } from 'smtp-server';
import type { MessageStore } from './store.js';

function addressOf(address: SMTPServerAddress | false): string {
  return address ? address.address : '';
}

/** Accepts any mail on loopback without auth or TLS and files it, parsed, in the store. */
export async function startSmtp(store: MessageStore, port: number, host: string): Promise<{ server: SMTPServer; port: number }> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    banner: 'Fluxtrail mail sink (local, keeps mail in memory)',
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          store.add({
            receivedAt: new Date().toISOString(),
            from: parsed.from?.text || addressOf(session.envelope.mailFrom),
            to: session.envelope.rcptTo.map((recipient) => recipient.address),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: parsed.html || undefined,
          });
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  await new Promise<void>((resolve, reject) => {
    // SMTPServer re-emits its socket's errors; without a listener a busy port would crash the process.
    server.once('error', reject);
    server.listen(port, host, () => {
      server.off('error', reject);
      server.on('error', (error) => console.error(`mail-fake: SMTP error: ${error.message}`));
      resolve();
    });
  });
  return { server, port: (server.server.address() as AddressInfo).port };
}
