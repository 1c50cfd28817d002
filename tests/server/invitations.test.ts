import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { invitationLifetimeHours } from '@shared/schemas/invitation';
import { Invitation } from '@server/modules/invitations/invitation.entity';
import { createMailTestApp, linkPath, testPublicUrl, tokenOf, waitForMessages, type MailTestApp } from './mail-test-app';
import { signInEveryRole } from './role-sessions';
import { client, removeDataDir } from './test-app';

let testApp: MailTestApp;
let roles: Awaited<ReturnType<typeof signInEveryRole>>;

beforeAll(async () => {
  testApp = await createMailTestApp();
  roles = await signInEveryRole(testApp.app);
});

afterAll(async () => {
  await testApp.close();
  removeDataDir(testApp.dataDir);
});

/** Invites an address as the admin and returns the link path read out of the message that arrived over SMTP. */
async function invite(email: string, role = 'kineticist'): Promise<string> {
  const before = (await waitForMessages(testApp.dataSource, email, 0)).length;
  await roles.as('admin').post('/api/invitations', { email, role }).expect(201);
  const messages = await waitForMessages(testApp.dataSource, email, before + 1);
  return linkPath(messages[messages.length - 1].text, '/invitation');
}

async function accept(path: string, name = 'Invented Invitee', password = 'invitee-password-1') {
  const visitor = await client(testApp.app);
  const response = await visitor.agent.post('/api/invitations/accept').set('X-CSRF-Token', visitor.csrfToken).send({ token: tokenOf(path), name, password });
  return { visitor, response };
}

describe('POST /api/invitations', () => {
  it('returns 403 for every role but admin and 401 signed out', async () => {
    for (const role of ['lead', 'kineticist', 'biologist', 'viewer'] as const) {
      await roles.as(role).post('/api/invitations', { email: 'x@kcatalog.example', role: 'viewer' }).expect(403);
    }
    const anonymous = await client(testApp.app);
    await anonymous.agent.post('/api/invitations').set('X-CSRF-Token', anonymous.csrfToken).send({ email: 'x@kcatalog.example', role: 'viewer' }).expect(401);
  });

  it('answers 400 with field messages for a bad address or role and stores nothing', async () => {
    const { body } = await roles.as('admin').post('/api/invitations', { email: 'not an address', role: 'wizard' }).expect(400);
    expect(body.error.fields).toEqual({ email: 'must be an e-mail address', role: expect.stringContaining('admin, lead') });
    expect(await testApp.dataSource.getRepository(Invitation).count()).toBe(0);
    expect((await testApp.dataSource.query('SELECT COUNT(*) AS n FROM outbox_messages'))[0].n).toBe(0);
  });

  it('refuses an address that already has an account with 409', async () => {
    const { body } = await roles.as('admin').post('/api/invitations', { email: 'Viewer@kcatalog.example', role: 'lead' }).expect(409);
    expect(body.error.message).toMatch(/already has an account/);
  });
});

describe('an invitation, end to end through the fake SMTP server', () => {
  it('arrives with a single-use link; the invitee sets name and password and is signed in', async () => {
    const path = await invite('New.Person@Kcatalog.example', 'kineticist');
    const [message] = await waitForMessages(testApp.dataSource, 'new.person@kcatalog.example');
    expect(message.subject).toBe('Ines Okafor-Lind invited you to Kcatalog');
    expect(message.html).toContain(`${testPublicUrl}/invitation?token=`);
    expect(message.text).toContain(`until`);
    // Only the hash of the token is stored.
    const token = tokenOf(path);
    const stored = await testApp.dataSource.getRepository(Invitation).findOneByOrFail({ email: 'new.person@kcatalog.example' });
    expect(stored.tokenHash).toMatch(/^[0-9a-f]{64}$/);
    expect(JSON.stringify(await testApp.dataSource.query('SELECT * FROM invitations'))).not.toContain(token);
    expect(stored.expiresAt.getTime() - stored.createdAt.getTime()).toBeGreaterThan((invitationLifetimeHours - 0.1) * 3600_000);

    const visitor = await client(testApp.app);
    const lookup = await visitor.agent.get(`/api/invitations/lookup?token=${token}`).expect(200);
    expect(lookup.body.invitation).toMatchObject({ email: 'new.person@kcatalog.example', role: 'kineticist', invitedBy: 'Ines Okafor-Lind' });

    const accepted = await visitor.agent.post('/api/invitations/accept').set('X-CSRF-Token', visitor.csrfToken).send({ token, name: 'Noa Invented', password: 'noa-password-123' }).expect(201);
    expect(accepted.body.user).toMatchObject({ email: 'new.person@kcatalog.example', name: 'Noa Invented', role: 'kineticist' });
    const me = await visitor.agent.get('/api/auth/me').expect(200);
    expect(me.body.user.email).toBe('new.person@kcatalog.example');
    // The new password works for a fresh sign-in.
    const fresh = await client(testApp.app);
    await fresh.agent.post('/api/auth/sign-in').set('X-CSRF-Token', fresh.csrfToken).send({ email: 'new.person@kcatalog.example', password: 'noa-password-123' }).expect(200);

    const list = await roles.as('admin').get('/api/invitations').expect(200);
    expect(list.body.invitations.find((item: { email: string }) => item.email === 'new.person@kcatalog.example').status).toBe('accepted');
  });

  it('refuses the link a second time', async () => {
    const path = await invite('twice@kcatalog.example');
    await accept(path).then(({ response }) => expect(response.status).toBe(201));
    const { response } = await accept(path, 'Someone Else', 'other-password-1');
    expect(response.status).toBe(400);
    expect(response.body.error).toMatchObject({ code: 'invalid_token', fields: { token: 'was already used' } });
    expect((await testApp.dataSource.query(`SELECT name FROM users WHERE email = 'twice@kcatalog.example'`))[0].name).toBe('Invented Invitee');
  });

  it('refuses an expired link and creates no account', async () => {
    const path = await invite('late@kcatalog.example');
    await testApp.dataSource.query(`UPDATE invitations SET expires_at = '2020-01-01 00:00:00.000' WHERE email = 'late@kcatalog.example'`);
    const visitor = await client(testApp.app);
    const lookup = await visitor.agent.get(`/api/invitations/lookup?token=${tokenOf(path)}`).expect(400);
    expect(lookup.body.error.fields).toEqual({ token: 'has expired' });
    const { response } = await accept(path);
    expect(response.status).toBe(400);
    expect(response.body.error.fields).toEqual({ token: 'has expired' });
    expect((await testApp.dataSource.query(`SELECT COUNT(*) AS n FROM users WHERE email = 'late@kcatalog.example'`))[0].n).toBe(0);
  });

  it('makes an earlier link void when the address is invited again, and refuses a withdrawn one', async () => {
    const first = await invite('again@kcatalog.example');
    const second = await invite('again@kcatalog.example', 'biologist');
    expect((await accept(first)).response.body.error.fields).toEqual({ token: 'was withdrawn' });

    const list = await roles.as('admin').get('/api/invitations').expect(200);
    const pending = list.body.invitations.find((item: { email: string; status: string }) => item.email === 'again@kcatalog.example' && item.status === 'pending');
    await roles.as('admin').post(`/api/invitations/${pending.id}/revoke`, { version: pending.version + 1 }).expect(409);
    const revoked = await roles.as('admin').post(`/api/invitations/${pending.id}/revoke`, { version: pending.version }).expect(200);
    expect(revoked.body.invitation.status).toBe('revoked');
    await roles.as('admin').post(`/api/invitations/${pending.id}/revoke`, { version: revoked.body.invitation.version }).expect(409);
    expect((await accept(second)).response.body.error.fields).toEqual({ token: 'was withdrawn' });
  });

  it('answers 400 with field messages for a malformed token, a short password or a missing name', async () => {
    const path = await invite('careful@kcatalog.example');
    const visitor = await client(testApp.app);
    const bad = await visitor.agent.post('/api/invitations/accept').set('X-CSRF-Token', visitor.csrfToken).send({ token: 'short', name: ' ', password: 'short' }).expect(400);
    expect(bad.body.error.fields).toEqual({
      token: 'is not a valid link; copy the whole link from the e-mail',
      name: 'is required',
      password: 'must be at least 10 characters',
    });
    const unknown = await visitor.agent.post('/api/invitations/accept').set('X-CSRF-Token', visitor.csrfToken).send({ token: 'A'.repeat(43), name: 'X', password: 'long-enough-1' }).expect(400);
    expect(unknown.body.error.fields).toEqual({ token: 'is not a valid invitation link' });
    await visitor.agent.get('/api/invitations/lookup').expect(400);
    // The invitation is still usable after the refusals.
    expect((await accept(path)).response.status).toBe(201);
  });

  it('requires the CSRF token to accept', async () => {
    const path = await invite('csrf@kcatalog.example');
    const visitor = await client(testApp.app);
    await visitor.agent.post('/api/invitations/accept').send({ token: tokenOf(path), name: 'X', password: 'long-enough-1' }).expect(403);
  });
});
