import { randomBytes, randomUUID } from 'node:crypto';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import express from 'express';
import { exportJWK, generateKeyPair } from 'jose';
import Provider from 'oidc-provider';
import { buildConfiguration } from './configuration.js';
import { interactionRoutes } from './interactions.js';

export interface IdpOptions {
  /** Port on 127.0.0.1; 0 picks a free one (the issuer then follows the chosen port). */
  port: number;
  issuer?: string;
  appBaseUrls: string[];
  apiAudience?: string;
}

export interface RunningIdp {
  close(): Promise<void>;
  issuer: string;
}

export const DEFAULT_API_AUDIENCE = 'urn:fluxtrail:api';

/** Starts the demo OpenID Provider: sign-in pages, the registered clients and JWT access tokens. */
export async function startIdp(options: IdpOptions): Promise<RunningIdp> {
  if (!Array.isArray(options.appBaseUrls) || options.appBaseUrls.length === 0) {
    throw new Error('startIdp: appBaseUrls must list at least one app base URL');
  }
  const server = createServer();
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, '127.0.0.1', () => resolve());
  });
  const { port } = server.address() as AddressInfo;
  const issuer = options.issuer ?? `http://127.0.0.1:${port}`;

  // A fresh signing key per start: tokens from an earlier run must not verify.
  const { privateKey } = await generateKeyPair('RS256', { extractable: true });
  const signingJwk = { ...(await exportJWK(privateKey)), alg: 'RS256', use: 'sig', kid: randomUUID() };

  const provider = new Provider(issuer, buildConfiguration({
    appBaseUrls: options.appBaseUrls,
    apiAudience: options.apiAudience ?? DEFAULT_API_AUDIENCE,
    signingJwk,
    cookieKeys: [randomBytes(32).toString('base64url')],
  }));

  const app = express();
  app.disable('x-powered-by');
  app.use(interactionRoutes(provider));
  app.use(provider.callback());
  server.on('request', app);

  return {
    issuer,
    close: () => new Promise<void>((resolve, reject) => {
      server.close((error) => (error ? reject(error) : resolve()));
      server.closeAllConnections();
    }),
  };
}
