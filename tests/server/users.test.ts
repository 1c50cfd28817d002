import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { roles } from '@shared/auth/permissions';
import { createTestApp, demoEmail, removeDataDir, signedIn, type TestApp } from './test-app';

let testApp: TestApp;

beforeAll(async () => {
  testApp = await createTestApp();
});

afterAll(async () => {
  await testApp.close();
  removeDataDir(testApp.dataDir);
});

const nonAdmins = roles.filter((role) => role !== 'admin');

describe('role × route matrix for /api/users', () => {
  it.each(nonAdmins)('returns 403 for a %s on every users route', async (role) => {
    const session = await signedIn(testApp.app, demoEmail(role));
    await session.agent.get('/api/users').expect(403);
    await session.agent
      .post('/api/users')
      .set('X-CSRF-Token', session.csrfToken)
      .send({ email: 'x@kcatalog.example', name: 'X', role: 'viewer', password: 'long-enough-password' })
      .expect(403);
    await session.agent.patch('/api/users/1').set('X-CSRF-Token', session.csrfToken).send({ version: 1, role: 'admin' }).expect(403);
  });

  it('returns 401 when signed out', async () => {
    const session = await signedIn(testApp.app, demoEmail('viewer'));
    await session.agent.post('/api/auth/sign-out').set('X-CSRF-Token', session.csrfToken).expect(204);
    await session.agent.get('/api/users').expect(401);
  });
});

describe('users administration', () => {
  it('lets an admin create a user who can then sign in', async () => {
    const admin = await signedIn(testApp.app, demoEmail('admin'));
    const created = await admin.agent
      .post('/api/users')
      .set('X-CSRF-Token', admin.csrfToken)
      .send({ email: 'New.Person@Kcatalog.example', name: 'New Person', role: 'kineticist', password: 'initial-password' })
      .expect(201);
    expect(created.body.user).toMatchObject({ email: 'new.person@kcatalog.example', role: 'kineticist', active: true, version: 1 });
    expect(created.body.user).not.toHaveProperty('passwordHash');
    await signedIn(testApp.app, 'new.person@kcatalog.example', 'initial-password');
  });

  it('returns 409 for an address that is already taken, in any case', async () => {
    const admin = await signedIn(testApp.app, demoEmail('admin'));
    const response = await admin.agent
      .post('/api/users')
      .set('X-CSRF-Token', admin.csrfToken)
      .send({ email: 'LEAD@kcatalog.example', name: 'Dup', role: 'viewer', password: 'initial-password' })
      .expect(409);
    expect(response.body.error.message).toContain('lead@kcatalog.example');
  });

  it('returns 400 with field messages for a bad user body and writes nothing', async () => {
    const admin = await signedIn(testApp.app, demoEmail('admin'));
    const before = (await admin.agent.get('/api/users')).body.users.length;
    const response = await admin.agent
      .post('/api/users')
      .set('X-CSRF-Token', admin.csrfToken)
      .send({ email: 'bad', name: '', role: 'wizard', password: 'short' })
      .expect(400);
    expect(Object.keys(response.body.error.fields).sort()).toEqual(['email', 'name', 'password', 'role']);
    expect((await admin.agent.get('/api/users')).body.users.length).toBe(before);
  });

  it('changes a role and refuses a stale version with 409', async () => {
    const admin = await signedIn(testApp.app, demoEmail('admin'));
    const { users } = (await admin.agent.get('/api/users')).body;
    const biologist = users.find((user: { email: string }) => user.email === demoEmail('biologist'));
    const changed = await admin.agent
      .patch(`/api/users/${biologist.id}`)
      .set('X-CSRF-Token', admin.csrfToken)
      .send({ version: biologist.version, role: 'lead' })
      .expect(200);
    expect(changed.body.user).toMatchObject({ role: 'lead', version: biologist.version + 1 });
    const stale = await admin.agent
      .patch(`/api/users/${biologist.id}`)
      .set('X-CSRF-Token', admin.csrfToken)
      .send({ version: biologist.version, role: 'viewer' })
      .expect(409);
    expect(stale.body.error.code).toBe('stale_version');
    const after = (await admin.agent.get('/api/users')).body.users.find((user: { id: number }) => user.id === biologist.id);
    expect(after.role).toBe('lead');
    await admin.agent.patch(`/api/users/${biologist.id}`).set('X-CSRF-Token', admin.csrfToken).send({ version: after.version, role: 'biologist' }).expect(200);
  });

  it('refuses to let an admin deactivate or demote themselves', async () => {
    const admin = await signedIn(testApp.app, demoEmail('admin'));
    const me = (await admin.agent.get('/api/users')).body.users.find((user: { email: string }) => user.email === demoEmail('admin'));
    const response = await admin.agent.patch(`/api/users/${me.id}`).set('X-CSRF-Token', admin.csrfToken).send({ version: me.version, active: false }).expect(400);
    expect(response.body.error.fields).toEqual({ active: 'cannot be changed on your own account' });
  });

  it('answers 400 for a non-numeric id and 404 for a missing user', async () => {
    const admin = await signedIn(testApp.app, demoEmail('admin'));
    await admin.agent.patch('/api/users/abc').set('X-CSRF-Token', admin.csrfToken).send({ version: 1, role: 'viewer' }).expect(400);
    await admin.agent.patch('/api/users/99999').set('X-CSRF-Token', admin.csrfToken).send({ version: 1, role: 'viewer' }).expect(404);
  });
});
