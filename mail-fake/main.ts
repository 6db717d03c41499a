import { startMailSink } from './index.js';

function portFromEnv(name: string, fallback: number): number {
  const port = Number(process.env[name] ?? fallback);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    throw new Error(`${name} must be a TCP port number, got "${process.env[name]}"`);
  }
  return port;
}

const sink = await startMailSink({
  smtpPort: portFromEnv('MAIL_SMTP_PORT', 2525),
  webPort: portFromEnv('MAIL_WEB_PORT', 3025),
});
console.log(`mail-fake: SMTP on 127.0.0.1:${sink.smtpPort}, inbox at http://127.0.0.1:${sink.webPort}/`);

async function stop(signal: string): Promise<void> {
  console.log(`mail-fake: ${signal}, stopping`);
  await sink.close();
  process.exit(0);
}
process.once('SIGTERM', () => void stop('SIGTERM'));
process.once('SIGINT', () => void stop('SIGINT'));
