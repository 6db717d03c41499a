// The slice of oidc-provider 9's API that idp-fake uses; the package ships no type declarations.
declare module 'oidc-provider' {
  import type { IncomingMessage, ServerResponse } from 'node:http';

  export interface ClientMetadata {
    client_id: string;
    client_secret?: string;
    grant_types?: string[];
    response_types?: string[];
    redirect_uris?: string[];
    post_logout_redirect_uris?: string[];
    token_endpoint_auth_method?: string;
    scope?: string;
    client_name?: string;
  }

  export interface Client {
    clientId: string;
    clientName?: string;
    scope?: string;
    grantTypes: string[];
  }

  export interface Grant {
    jti: string;
    accountId: string;
    clientId: string;
    addOIDCScope(scope: string): void;
    addOIDCClaims(claims: string[]): void;
    addResourceScope(resource: string, scope: string): void;
    save(): Promise<string>;
  }

  export interface GrantConstructor {
    new (properties: { accountId: string; clientId: string }): Grant;
    find(id: string): Promise<Grant | undefined>;
  }

  export interface Session {
    accountId?: string;
    grantIdFor(clientId: string): string | undefined;
  }

  /** The Koa context oidc-provider hands to its configuration callbacks. */
  export interface KoaContextWithOIDC {
    body: unknown;
    type: string;
    status: number;
    host: string;
    set(field: string, value: string): void;
    oidc: {
      client?: Client;
      session: Session;
      account?: { accountId: string };
      result?: { consent?: { grantId?: string } };
      params?: Record<string, unknown>;
      provider: Provider;
    };
  }

  export interface Account {
    accountId: string;
    claims(use: string, scope: string): Promise<Record<string, unknown>> | Record<string, unknown>;
  }

  export interface ResourceServer {
    scope: string;
    audience: string;
    accessTokenFormat: 'jwt' | 'opaque';
    jwt?: { sign: { alg: string } };
  }

  export interface InteractionDetails {
    uid: string;
    prompt: {
      name: string;
      reasons: string[];
      details: {
        missingOIDCScope?: string[];
        missingOIDCClaims?: string[];
        missingResourceScopes?: Record<string, string[]>;
      };
    };
    params: Record<string, unknown>;
    grantId?: string;
    session?: { accountId: string };
  }

  export type InteractionResult =
    | { login: { accountId: string } }
    | { consent: { grantId: string } };

  export interface Configuration {
    clients: ClientMetadata[];
    jwks: { keys: object[] };
    cookies?: { keys: string[] };
    claims?: Record<string, string[]>;
    scopes?: string[];
    conformIdTokenClaims?: boolean;
    responseTypes?: string[];
    pkce?: { required: (ctx: KoaContextWithOIDC, client: Client) => boolean };
    findAccount: (ctx: KoaContextWithOIDC, id: string) => Promise<Account | undefined>;
    loadExistingGrant?: (ctx: KoaContextWithOIDC) => Promise<Grant | undefined>;
    renderError?: (ctx: KoaContextWithOIDC, out: Record<string, string>, error: Error) => Promise<void>;
    interactions?: { url: (ctx: KoaContextWithOIDC, interaction: { uid: string }) => string };
    ttl?: Record<string, number | ((ctx: KoaContextWithOIDC, token: unknown, client: Client) => number)>;
    features?: Record<string, object>;
  }

  class Provider {
    constructor(issuer: string, configuration: Configuration);
    Grant: GrantConstructor;
    callback(): (req: IncomingMessage, res: ServerResponse) => void;
    interactionDetails(req: IncomingMessage, res: ServerResponse): Promise<InteractionDetails>;
    interactionFinished(
      req: IncomingMessage,
      res: ServerResponse,
      result: InteractionResult,
      options?: { mergeWithLastSubmission?: boolean },
    ): Promise<void>;
  }

  export const errors: {
    InvalidTarget: new (description?: string) => Error;
    SessionNotFound: new (description?: string) => Error;
  };

  export default Provider;
}
