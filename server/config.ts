import { z } from 'zod';

/** Configuration from the environment, validated once at start-up; a bad value stops the server. */
const configSchema = z.object({
  FLUXTRAIL_HOST: z.string().default('127.0.0.1'),
  FLUXTRAIL_PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  FLUXTRAIL_PUBLIC_URL: z.url().default('http://127.0.0.1:3000'),
  FLUXTRAIL_DB_HOST: z.string().default('127.0.0.1'),
  FLUXTRAIL_DB_PORT: z.coerce.number().int().min(1).max(65535).default(3307),
  /** MariaDB's Unix socket, when it runs on this machine: used instead of host and port. */
  FLUXTRAIL_DB_SOCKET: z.string().min(1).optional(),
  FLUXTRAIL_DB_USER: z.string().min(1).default('fluxtrail'),
  FLUXTRAIL_DB_PASSWORD: z.string().min(1, 'the database password must be set'),
  FLUXTRAIL_DB_NAME: z.string().regex(/^[A-Za-z0-9_]+$/, 'letters, digits and _ only').default('fluxtrail'),
  FLUXTRAIL_DB_POOL_MAX: z.coerce.number().int().min(2).max(200).default(20),
  FLUXTRAIL_OIDC_ISSUER: z.url().default('http://127.0.0.1:3001'),
  FLUXTRAIL_OIDC_CLIENT_ID: z.string().min(1).default('fluxtrail-web'),
  FLUXTRAIL_OIDC_CLIENT_SECRET: z.string().min(1).default('fluxtrail-web-secret'),
  FLUXTRAIL_API_AUDIENCE: z.string().min(1).default('urn:fluxtrail:api'),
  FLUXTRAIL_SESSION_SECRET: z.string().min(32, 'the session secret must be at least 32 characters'),
  FLUXTRAIL_SMTP_HOST: z.string().default('127.0.0.1'),
  FLUXTRAIL_SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  FLUXTRAIL_MAIL_FROM: z.string().default('Fluxtrail <fluxtrail@plant.example>'),
  FLUXTRAIL_DATA_DIR: z.string().default('.data'),
  FLUXTRAIL_STATIC_DIR: z.string().default('dist'),
  FLUXTRAIL_JOBS: z.enum(['on', 'off']).default('on'),
  FLUXTRAIL_LOGIN_RATE_LIMIT: z.coerce.number().int().min(1).default(30),
  FLUXTRAIL_WORKERS: z.coerce.number().int().min(1).max(32).default(1),
});

export type Config = {
  host: string;
  port: number;
  publicUrl: string;
  db: { host: string; port: number; socketPath?: string; user: string; password: string; database: string; poolMax: number };
  oidc: { issuer: string; clientId: string; clientSecret: string; apiAudience: string };
  sessionSecret: string;
  smtp: { host: string; port: number; from: string };
  dataDir: string;
  staticDir: string;
  jobsEnabled: boolean;
  loginRateLimit: number;
  /** App processes sharing the port (node:cluster); the server is stateless, so any number may run. */
  workers: number;
};

export class ConfigError extends Error {}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = configSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((issue) => `  ${issue.path.join('.')}: ${issue.message}`);
    throw new ConfigError(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  return {
    host: e.FLUXTRAIL_HOST,
    port: e.FLUXTRAIL_PORT,
    publicUrl: e.FLUXTRAIL_PUBLIC_URL.replace(/\/$/, ''),
    db: {
      host: e.FLUXTRAIL_DB_HOST, port: e.FLUXTRAIL_DB_PORT, socketPath: e.FLUXTRAIL_DB_SOCKET, user: e.FLUXTRAIL_DB_USER,
      password: e.FLUXTRAIL_DB_PASSWORD, database: e.FLUXTRAIL_DB_NAME, poolMax: e.FLUXTRAIL_DB_POOL_MAX,
    },
    oidc: {
      issuer: e.FLUXTRAIL_OIDC_ISSUER.replace(/\/$/, ''), clientId: e.FLUXTRAIL_OIDC_CLIENT_ID,
      clientSecret: e.FLUXTRAIL_OIDC_CLIENT_SECRET, apiAudience: e.FLUXTRAIL_API_AUDIENCE,
    },
    sessionSecret: e.FLUXTRAIL_SESSION_SECRET,
    smtp: { host: e.FLUXTRAIL_SMTP_HOST, port: e.FLUXTRAIL_SMTP_PORT, from: e.FLUXTRAIL_MAIL_FROM },
    dataDir: e.FLUXTRAIL_DATA_DIR,
    staticDir: e.FLUXTRAIL_STATIC_DIR,
    jobsEnabled: e.FLUXTRAIL_JOBS === 'on',
    loginRateLimit: e.FLUXTRAIL_LOGIN_RATE_LIMIT,
    workers: e.FLUXTRAIL_WORKERS,
  };
}
