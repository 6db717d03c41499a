import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { startSmtp } from './smtp.js';
import { MessageStore } from './store.js';
import type { StoredMessage } from './store.js';
import { webHandler } from './web.js';

export type { StoredMessage } from './store.js';

export interface MailSinkOptions {
  /** SMTP port; 0 picks a free one (read it back from the result). */
  smtpPort: number;
  /** Port of the inbox page and JSON API; 0 picks a free one. */
  webPort: number;
  host?: string;
}

export interface RunningMailSink {
  close(): Promise<void>;
  messages(): StoredMessage[];
  smtpPort: number;
  webPort: number;
}

/** Starts the local SMTP sink and its inbox web page; mail is kept in memory only. */
export async function startMailSink(options: MailSinkOptions): Promise<RunningMailSink> {
  const host = options.host ?? '127.0.0.1';
  const store = new MessageStore();
  const smtp = await startSmtp(store, options.smtpPort, host);

  const web = createServer(webHandler(store));
  try {
    await new Promise<void>((resolve, reject) => {
      web.once('error', reject);
      web.listen(options.webPort, host, () => resolve());
    });
  } catch (error) {
    await new Promise<void>((resolve) => smtp.server.close(() => resolve()));
    throw error;
  }

  return {
    smtpPort: smtp.port,
    webPort: (web.address() as AddressInfo).port,
    messages: () => store.list(),
    close: async () => {
      const webClosed = new Promise<void>((resolve) => web.close(() => resolve()));
      web.closeAllConnections();
      await Promise.all([webClosed, new Promise<void>((resolve) => smtp.server.close(() => resolve()))]);
    },
  };
}
