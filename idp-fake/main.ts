import { startIdp } from './index.js';

const DEFAULT_APP_BASE_URLS = 'http://127.0.0.1:3000,http://127.0.0.1:5173';

const port = Number(process.env.IDP_PORT ?? 3001);
if (!Number.isInteger(port) || port < 0 || port > 65535) {
  throw new Error(`IDP_PORT must be a TCP port number, got "${process.env.IDP_PORT}"`);
}
const appBaseUrls = (process.env.APP_BASE_URLS ?? DEFAULT_APP_BASE_URLS)
  .split(',')
  .map((url) => url.trim())
  .filter(Boolean);

const idp = await startIdp({ port, issuer: process.env.IDP_ISSUER || undefined, appBaseUrls });
console.log(`idp-fake: issuer ${idp.issuer}, apps ${appBaseUrls.join(', ')}`);

async function stop(signal: string): Promise<void> {
  console.log(`idp-fake: ${signal}, stopping`);
  await idp.close();
  process.exit(0);
}
process.once('SIGTERM', () => void stop('SIGTERM'));
process.once('SIGINT', () => void stop('SIGINT'));
