import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startApiServer } from '../support/api-server.js';
import { truncateAll } from '../support/migrate.js';
import { signIn } from '../support/sign-in.js';
import type { RunningServer } from '../../server/index.js';
import { describeRule } from '../../server/analysis/spc/index.js';

describe('SPC rule choices for the trial-limits picker', () => {
  let server: RunningServer;
  let quality: string;

  beforeAll(async () => { server = await startApiServer(); });
  afterAll(async () => { await server.stop(); });
  beforeEach(async () => {
    await truncateAll(server.db);
    quality = (await signIn(server.url, 'quality')).cookie;
  });

  it('when the picker asks for the rules, then Nelson 1–8 come in order with their wording and rules 1, 2, 3 and 5 marked default', async () => {
    const { body } = await request(server.url).get('/api/v1/spc/rules').set('cookie', quality).expect(200);
    const nelson = body.rules.filter((r: { family: string }) => r.family === 'nelson');
    expect(nelson.map((r: { rule: string }) => r.rule)).toEqual([1, 2, 3, 4, 5, 6, 7, 8].map((n) => `nelson-${n}`));
    expect(nelson[0].text).toBe(describeRule('nelson-1'));
    expect(nelson.filter((r: { isDefault: boolean }) => r.isDefault).map((r: { rule: string }) => r.rule)).toEqual(['nelson-1', 'nelson-2', 'nelson-3', 'nelson-5']);
  });

  it('when no one is signed in, then the rules answer 401', async () => {
    await request(server.url).get('/api/v1/spc/rules').expect(401);
  });
});
