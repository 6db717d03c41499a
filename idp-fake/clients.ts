import type { ClientMetadata } from 'oidc-provider';

export const WEB_CLIENT_ID = 'fluxtrail-web';
export const SHORT_LIVED_CLIENT_ID = 'short-lived-station';

/** A machine client that may only use the client-credentials grant for the given scope. */
function machineClient(clientId: string, scope: string): ClientMetadata {
  return {
    client_id: clientId,
    client_secret: `${clientId}-secret`,
    grant_types: ['client_credentials'],
    response_types: [],
    redirect_uris: [],
    token_endpoint_auth_method: 'client_secret_basic',
    scope,
  };
}

/** The registered clients: the browser app and the station/integration machine clients. */
export function buildClients(appBaseUrls: string[]): ClientMetadata[] {
  const bases = appBaseUrls.map((base) => base.replace(/\/+$/, ''));
  return [
    {
      client_id: WEB_CLIENT_ID,
      client_secret: 'fluxtrail-web-secret',
      client_name: 'Fluxtrail',
      grant_types: ['authorization_code', 'refresh_token'],
      response_types: ['code'],
      token_endpoint_auth_method: 'client_secret_basic',
      redirect_uris: bases.map((base) => `${base}/auth/callback`),
      post_logout_redirect_uris: bases.flatMap((base) => [`${base}/signed-out`, `${base}/`]),
      scope: 'openid offline_access profile email roles',
    },
    machineClient('demo-station', 'test-runs:write'),
    machineClient('demo-station-b', 'test-runs:write'),
    machineClient('demo-integration', 'records:read'),
    machineClient(SHORT_LIVED_CLIENT_ID, 'test-runs:write'),
  ];
}
