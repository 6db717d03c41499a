// Shared by the setup-*.test.ts files: signed-in agents per demo account and invented demo bodies.
import request from 'supertest';
import type { Knex } from 'knex';
import { signIn } from '../support/sign-in.js';

export type Agent = {
  get(path: string): request.Test;
  post(path: string, body?: object): request.Test;
  put(path: string, body: object): request.Test;
};

/** A signed-in caller; writes carry the CSRF header the browser client sends. */
export async function signedIn(appUrl: string, login: string): Promise<Agent> {
  const { cookie } = await signIn(appUrl, login);
  if (!cookie) throw new Error(`sign-in as ${login} gave no session cookie`);
  return {
    get: (path) => request(appUrl).get(path).set('cookie', cookie),
    post: (path, body = {}) => request(appUrl).post(path).set('cookie', cookie).set('x-fluxtrail-csrf', '1').send(body),
    put: (path, body) => request(appUrl).put(path).set('cookie', cookie).set('x-fluxtrail-csrf', '1').send(body),
  };
}

/** An invented 400 V traction PMSM. */
export function demoProduct(code: string, overrides: Record<string, unknown> = {}) {
  return {
    code, name: `Demo traction motor ${code}`, motorKind: 'pmsm', polePairs: 4, resolverPolePairs: 4,
    ratedVoltageV: 400, ratedPowerKw: 85, ratedSpeedRpm: 6000, windingMaterial: 'copper', windingType: 'random',
    insulationClass: 'H', serialPattern: '^QX\\d{7}$', ...overrides,
  };
}

export function demoCharacteristic(code: string, overrides: Record<string, unknown> = {}) {
  return {
    code, name: `Demo ${code}`, unit: 'V/krpm', testStep: 'back-emf', spcEnabled: true,
    subgroupMode: 'individual', subgroupSize: null, sortOrder: 0, ...overrides,
  };
}

export const setupApi = '/api/v1/setup';

/** A product with two characteristics, made through the API as quality. */
export async function productWithCharacteristics(quality: Agent, code: string) {
  await quality.post(`${setupApi}/products`, demoProduct(code)).expect(201);
  await quality.post(`${setupApi}/products/${code}/characteristics`, demoCharacteristic('bemf.ke', { sortOrder: 1 })).expect(201);
  await quality.post(`${setupApi}/products/${code}/characteristics`, demoCharacteristic('wr.r20', { unit: 'mΩ', testStep: 'winding-resistance', sortOrder: 2 })).expect(201);
}

// JSON columns may arrive parsed by mysql2 or as text, depending on how MariaDB reports the type.
export type AuditRow = { action: string; actor: string; actor_role: string; before_json: unknown; after_json: unknown; reason: string | null };

export async function auditOf(db: Knex, entityType: string, entityId: string | number): Promise<AuditRow[]> {
  return db('audit_events').where({ entity_type: entityType, entity_id: String(entityId) }).orderBy('id');
}

export const parsed = (json: unknown) => (typeof json === 'string' ? JSON.parse(json) : json);
