import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startApiServer } from '../support/api-server.js';
import { signIn } from '../support/sign-in.js';
import type { RunningServer } from '../../server/index.js';
import { permissionsOf, roles } from '../../server/auth/permissions.js';

describe('sign-in through the IdP fake and GET /api/me', () => {
  let server: RunningServer;
  beforeAll(async () => { server = await startApiServer(); });
  afterAll(async () => { await server.stop(); });

  it('when no session is present, then /api/me answers 401 with the error model', async () => {
    const response = await request(server.url).get('/api/me');
    expect(response.status).toBe(401);
    expect(response.body).toEqual({ error: { code: 'unauthenticated', message: expect.any(String) } });
  });

  it.each([...roles, 'quality2'])('when %s signs in, then /api/me names the role and its permissions', async (login) => {
    const { cookie } = await signIn(server.url, login);
    expect(cookie).toMatch(/^fluxtrail\.sid=/);
    const response = await request(server.url).get('/api/me').set('cookie', cookie);
    expect(response.status).toBe(200);
    const role = login === 'quality2' ? 'quality' : login;
    expect(response.body.role).toBe(role);
    expect(response.body.user.email).toBe(`${login}@plant.example`);
    expect(response.body.permissions).toEqual([...permissionsOf(role as (typeof roles)[number])]);
  });

  it('when a person signs in the first time, then a user row and an audit event are written', async () => {
    await signIn(server.url, 'auditor');
    const user = await server.db('users').where({ subject: 'auditor' }).first();
    expect(user.role).toBe('auditor');
    const event = await server.db('audit_events').where({ entity_type: 'user', entity_id: 'auditor' }).first();
    expect(event.action).toBe('user.first-sign-in');
  });

  it('when the password is wrong, then no session is created and the form says so', async () => {
    const result = await signIn(server.url, 'operator', 'not-the-password');
    expect(result.body).toContain('Wrong login or password.');
    // The pending-login cookie exists, but it carries no signed-in user.
    const me = await request(server.url).get('/api/me').set('cookie', result.cookie);
    expect(me.status).toBe(401);
  });

  it('when a person signs out, then the session no longer works', async () => {
    const { cookie } = await signIn(server.url, 'manager');
    const logout = await request(server.url).get('/auth/logout').set('cookie', cookie);
    expect(logout.status).toBe(302);
    expect(logout.headers.location).toContain('/session/end');
    const me = await request(server.url).get('/api/me').set('cookie', cookie);
    expect(me.status).toBe(401);
  });

  it('when a cookie-authenticated write lacks the CSRF header or comes from another origin, then it is refused', async () => {
    const { cookie } = await signIn(server.url, 'quality');
    const noHeader = await request(server.url).post('/api/me').set('cookie', cookie).send({});
    expect(noHeader.status).toBe(403);
    expect(noHeader.body.error.code).toBe('csrf_failed');
    const foreign = await request(server.url).post('/api/me').set('cookie', cookie)
      .set('x-fluxtrail-csrf', '1').set('origin', 'http://evil.example').send({});
    expect(foreign.status).toBe(403);
    expect(foreign.body.error.code).toBe('csrf_failed');
  });

  it('when returnTo points off-site, then sign-in returns to the app root instead', async () => {
    const response = await request(server.url).get('/auth/login?returnTo=//evil.example/x');
    expect(response.status).toBe(302);
    // The signed cookie is "s:<sid>.<signature>"; find exactly this login's session row.
    const cookie = decodeURIComponent(String(response.headers['set-cookie']).split(';')[0].split('=')[1]);
    const sid = cookie.slice(2, cookie.lastIndexOf('.'));
    const session = await server.db('sessions').where({ sid }).first();
    const stored = typeof session.sess === 'string' ? JSON.parse(session.sess) : session.sess;
    expect(stored.login.returnTo).toBe('/');
  });

  it('when the server answers an API error, then security headers are set and no stack trace is shown', async () => {
    const response = await request(server.url).get('/api/no-such-thing');
    expect(response.status).toBe(404);
    expect(response.headers['x-content-type-options']).toBe('nosniff');
    expect(response.headers['content-security-policy']).toContain("default-src 'self'");
    expect(JSON.stringify(response.body)).not.toContain('at ');
  });
});
