import * as client from 'openid-client';
import type { Config } from '../config.js';

/**
 * Discovers the identity provider once and caches the result. Discovery is lazy and retried,
 * so the app may start before the IdP is reachable.
 */
export function createOidc(config: Config) {
  let discovered: Promise<client.Configuration> | null = null;
  const insecure = config.oidc.issuer.startsWith('http://');

  function configuration(): Promise<client.Configuration> {
    if (!discovered) {
      discovered = client
        .discovery(new URL(config.oidc.issuer), config.oidc.clientId, config.oidc.clientSecret, undefined,
          insecure ? { execute: [client.allowInsecureRequests] } : undefined)
        .catch((error: unknown) => {
          discovered = null;
          throw error;
        });
    }
    return discovered;
  }

  return {
    configuration,
    async jwksUri(): Promise<string> {
      const uri = (await configuration()).serverMetadata().jwks_uri;
      if (!uri) throw new Error('The identity provider publishes no jwks_uri');
      return uri;
    },
  };
}

export type Oidc = ReturnType<typeof createOidc>;
