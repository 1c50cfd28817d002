import request from 'supertest';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { createApp } from '@server/app';
import { openDatabase } from '@server/data-source';
import type { DatabaseSessionStore } from '@server/modules/sessions/database-session-store';
import { User } from '@server/modules/users/user.entity';
import { join } from 'node:path';
import { client, createTestApp, demoEmail, removeDataDir, sessionCookie, signedIn, testSecret, type TestApp } from './test-app';

let testApp: TestApp;

beforeEach(async () => {
  testApp = await createTestApp();
});

afterEach(async () => {
  await testApp.close();
  removeDataDir(testApp.dataDir);
});

describe('GET /api/health', () => {
  it('answers ok without a session', async () => {
    const response = await request(testApp.app).get('/api/health').expect(200);
    expect(response.body).toEqual({ status: 'ok' });
  });
});

describe('POST /api/auth/sign-in', () => {
  it('signs in a demo account, case-insensitively by e-mail', async () => {
    const session = await client(testApp.app);
    const response = await session.agent
      .post('/api/auth/sign-in')
      .set('X-CSRF-Token', session.csrfToken)
      .send({ email: 'Lead@KCatalog.example', password: 'kcatalog-demo' })
      .expect(200);
    expect(response.body.user).toMatchObject({ email: 'lead@kcatalog.example', role: 'lead' });
    expect(Object.keys(response.body.user).sort()).toEqual(['email', 'id', 'name', 'preferences', 'role']);
    const me = await session.agent.get('/api/auth/me').expect(200);
    expect(me.body.user.email).toBe('lead@kcatalog.example');
  });

  it('returns 401 invalid_credentials for a wrong password and for an unknown address', async () => {
    const session = await client(testApp.app);
    for (const body of [
      { email: demoEmail('lead'), password: 'not-the-password' },
      { email: 'nobody@kcatalog.example', password: 'kcatalog-demo' },
    ]) {
      const response = await session.agent.post('/api/auth/sign-in').set('X-CSRF-Token', session.csrfToken).send(body).expect(401);
      expect(response.body.error.code).toBe('invalid_credentials');
    }
  });

  it('refuses an inactive user exactly like a wrong password', async () => {
    await testApp.dataSource.getRepository(User).update({ email: demoEmail('viewer') }, { active: false });
    const session = await client(testApp.app);
    const response = await session.agent
      .post('/api/auth/sign-in')
      .set('X-CSRF-Token', session.csrfToken)
      .send({ email: demoEmail('viewer'), password: 'kcatalog-demo' })
      .expect(401);
    expect(response.body.error.code).toBe('invalid_credentials');
  });

  it('issues a new session id at sign-in and at sign-out', async () => {
    const session = await client(testApp.app);
    const before = sessionCookie(await session.agent.get('/api/auth/csrf'));
    const signInResponse = await session.agent
      .post('/api/auth/sign-in')
      .set('X-CSRF-Token', session.csrfToken)
      .send({ email: demoEmail('kineticist'), password: 'kcatalog-demo' })
      .expect(200);
    expect(before).toBeDefined();
    const during = sessionCookie(signInResponse);
    expect(during).toBeDefined();
    expect(during).not.toBe(before);

    const signOutResponse = await session.agent.post('/api/auth/sign-out').set('X-CSRF-Token', signInResponse.body.csrfToken).expect(204);
    const after = sessionCookie(signOutResponse);
    expect(after).toBeDefined();
    expect(after).not.toBe(during);
    await session.agent.get('/api/auth/me').expect(401);
  });

  it('answers 429 after 10 failed attempts within 15 minutes', async () => {
    const session = await client(testApp.app);
    const attempt = () =>
      session.agent.post('/api/auth/sign-in').set('X-CSRF-Token', session.csrfToken).send({ email: demoEmail('admin'), password: 'wrong-password' });
    for (let i = 0; i < 10; i += 1) expect((await attempt()).status).toBe(401);
    const limited = await attempt();
    expect(limited.status).toBe(429);
    expect(limited.body.error.code).toBe('rate_limited');
  });

  it('answers 400 with field messages for a bad body', async () => {
    const session = await client(testApp.app);
    const response = await session.agent.post('/api/auth/sign-in').set('X-CSRF-Token', session.csrfToken).send({ email: 'not-an-address', password: 42 }).expect(400);
    expect(response.body.error.code).toBe('validation_error');
    expect(response.body.error.fields).toMatchObject({ email: 'must be an e-mail address', password: expect.any(String) });
  });

  it('answers 400 for a body that is not JSON', async () => {
    const session = await client(testApp.app);
    const response = await session.agent
      .post('/api/auth/sign-in')
      .set('X-CSRF-Token', session.csrfToken)
      .set('Content-Type', 'application/json')
      .send('{"email":')
      .expect(400);
    expect(response.body.error.code).toBe('malformed_json');
  });
});

describe('CSRF protection', () => {
  it('returns 403 for a state-changing request without the X-CSRF-Token header', async () => {
    const session = await client(testApp.app);
    const response = await session.agent.post('/api/auth/sign-in').send({ email: demoEmail('admin'), password: 'kcatalog-demo' }).expect(403);
    expect(response.body.error.code).toBe('csrf_invalid');
  });

  it('returns 403 for a token from another session', async () => {
    const first = await client(testApp.app);
    const second = await client(testApp.app);
    await second.agent.post('/api/auth/sign-in').set('X-CSRF-Token', first.csrfToken).send({ email: demoEmail('admin'), password: 'kcatalog-demo' }).expect(403);
  });
});

describe('sessions', () => {
  it('survive an app restart on the same data folder', async () => {
    const session = await signedIn(testApp.app, demoEmail('biologist'));
    await session.agent.get('/api/auth/me').expect(200);
    await testApp.close();

    const dataSource = await openDatabase({ database: join(testApp.dataDir, 'kcatalog.sqlite') });
    const restarted = createApp(dataSource, { sessionSecret: testSecret });
    try {
      const me = await request(restarted).get('/api/auth/me').set('Cookie', session.cookie).expect(200);
      expect(me.body.user.email).toBe(demoEmail('biologist'));
    } finally {
      (restarted.locals.sessionStore as DatabaseSessionStore).close();
      await dataSource.destroy();
      testApp = await createTestApp();
    }
  });

  it('stop working at once when an admin deactivates the user', async () => {
    const viewer = await signedIn(testApp.app, demoEmail('viewer'));
    const admin = await signedIn(testApp.app, demoEmail('admin'));
    const users = await admin.agent.get('/api/users').expect(200);
    const target = users.body.users.find((user: { email: string }) => user.email === demoEmail('viewer'));
    await admin.agent.patch(`/api/users/${target.id}`).set('X-CSRF-Token', admin.csrfToken).send({ version: target.version, active: false }).expect(200);
    await viewer.agent.get('/api/auth/me').expect(401);
  });

  it('all end when the password changes, except the one that changed it', async () => {
    const laptop = await signedIn(testApp.app, demoEmail('kineticist'));
    const phone = await signedIn(testApp.app, demoEmail('kineticist'));
    const response = await laptop.agent
      .post('/api/auth/password')
      .set('X-CSRF-Token', laptop.csrfToken)
      .send({ currentPassword: 'kcatalog-demo', newPassword: 'a-new-long-password' })
      .expect(200);
    laptop.csrfToken = response.body.csrfToken;
    await laptop.agent.get('/api/auth/me').expect(200);
    await phone.agent.get('/api/auth/me').expect(401);
    await signedIn(testApp.app, demoEmail('kineticist'), 'a-new-long-password');
  });

  it('refuse a password change with a wrong current password or a short new one', async () => {
    const session = await signedIn(testApp.app, demoEmail('kineticist'));
    const wrong = await session.agent
      .post('/api/auth/password')
      .set('X-CSRF-Token', session.csrfToken)
      .send({ currentPassword: 'nope', newPassword: 'a-new-long-password' })
      .expect(400);
    expect(wrong.body.error.fields).toEqual({ currentPassword: 'is not correct' });
    const short = await session.agent
      .post('/api/auth/password')
      .set('X-CSRF-Token', session.csrfToken)
      .send({ currentPassword: 'kcatalog-demo', newPassword: 'short' })
      .expect(400);
    expect(short.body.error.fields.newPassword).toBe('must be at least 10 characters');
  });
});

describe('PATCH /api/auth/preferences', () => {
  it('remembers the energy unit per user and refuses unknown units', async () => {
    const session = await signedIn(testApp.app, demoEmail('lead'));
    const saved = await session.agent.patch('/api/auth/preferences').set('X-CSRF-Token', session.csrfToken).send({ energyUnit: 'kcal/mol' }).expect(200);
    expect(saved.body.preferences).toEqual({ energyUnit: 'kcal/mol' });
    expect((await session.agent.get('/api/auth/me')).body.user.preferences).toEqual({ energyUnit: 'kcal/mol' });
    const other = await signedIn(testApp.app, demoEmail('viewer'));
    expect((await other.agent.get('/api/auth/me')).body.user.preferences).toEqual({});
    const bad = await session.agent.patch('/api/auth/preferences').set('X-CSRF-Token', session.csrfToken).send({ energyUnit: 'eV' }).expect(400);
    expect(bad.body.error.fields.energyUnit).toBe('must be one of kJ/mol, kcal/mol');
  });
});

describe('unknown API routes', () => {
  it('answer a JSON 404, never the client page', async () => {
    const response = await request(testApp.app).get('/api/no-such-thing').expect(404);
    expect(response.headers['content-type']).toMatch(/application\/json/);
    expect(response.body.error.code).toBe('not_found');
  });
});

describe('GET /api/auth/demo-accounts', () => {
  it('lists the demo accounts only while they exist', async () => {
    const listed = await request(testApp.app).get('/api/auth/demo-accounts').expect(200);
    expect(listed.body.accounts).toHaveLength(5);
    await testApp.dataSource.query('DELETE FROM "users"');
    const empty = await request(testApp.app).get('/api/auth/demo-accounts').expect(200);
    expect(empty.body).toEqual({ accounts: [], password: null });
  });
});
