import { IsNull, Not } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { passwordResetRequestedMessage } from '@shared/schemas/password-reset';
import { PasswordReset } from '@server/modules/password-resets/password-reset.entity';
import { createMailTestApp, linkPath, receivedFor, tokenOf, waitForMessages, type MailTestApp } from './mail-test-app';
import { client, demoEmail, removeDataDir, signedIn } from './test-app';

let testApp: MailTestApp;

beforeAll(async () => {
  testApp = await createMailTestApp();
});

afterAll(async () => {
  await testApp.close();
  removeDataDir(testApp.dataDir);
});

async function requestReset(email: string) {
  const visitor = await client(testApp.app);
  return visitor.agent.post('/api/password-resets').set('X-CSRF-Token', visitor.csrfToken).send({ email });
}

/** Asks for a reset and returns the link path read out of the message that arrived over SMTP. */
async function resetLink(email: string): Promise<string> {
  const before = (await receivedFor(testApp.dataSource, email)).length;
  await requestReset(email).then((response) => expect(response.status).toBe(202));
  const messages = await waitForMessages(testApp.dataSource, email, before + 1);
  return linkPath(messages[messages.length - 1].text, '/reset-password');
}

async function complete(path: string, newPassword: string) {
  const visitor = await client(testApp.app);
  const response = await visitor.agent.post('/api/password-resets/complete').set('X-CSRF-Token', visitor.csrfToken).send({ token: tokenOf(path), newPassword });
  return { visitor, response };
}

async function canSignIn(email: string, password: string): Promise<boolean> {
  const visitor = await client(testApp.app);
  const response = await visitor.agent.post('/api/auth/sign-in').set('X-CSRF-Token', visitor.csrfToken).send({ email, password });
  return response.status === 200;
}

describe('POST /api/password-resets', () => {
  it('answers an address with and without an account in exactly the same way, and mails only the account', async () => {
    const known = await requestReset(demoEmail('biologist'));
    const unknown = await requestReset('nobody-here@kcatalog.example');
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(unknown.body).toEqual(known.body);
    expect(known.body).toEqual({ message: passwordResetRequestedMessage });
    expect(Object.keys(unknown.headers).sort()).toEqual(Object.keys(known.headers).sort());
    const [message] = await waitForMessages(testApp.dataSource, demoEmail('biologist'));
    expect(message.subject).toBe('Set a new Kcatalog password');
    // Give a message to the unknown address time to arrive, if the server wrongly sent one.
    await testApp.delivery.idle();
    await new Promise((done) => setTimeout(done, 200));
    expect(await receivedFor(testApp.dataSource, 'nobody-here@kcatalog.example')).toHaveLength(0);
  });

  it('sends nothing to a deactivated account, and still answers the same', async () => {
    await testApp.dataSource.query(`UPDATE users SET active = 0 WHERE email = ?`, [demoEmail('viewer')]);
    const response = await requestReset(demoEmail('viewer'));
    expect(response.status).toBe(202);
    expect(response.body).toEqual({ message: passwordResetRequestedMessage });
    await new Promise((done) => setTimeout(done, 200));
    expect(await receivedFor(testApp.dataSource, demoEmail('viewer'))).toHaveLength(0);
    await testApp.dataSource.query(`UPDATE users SET active = 1 WHERE email = ?`, [demoEmail('viewer')]);
  });

  it('answers 400 with a field message for a bad address', async () => {
    const response = await requestReset('not-an-address');
    expect(response.status).toBe(400);
    expect(response.body.error.fields).toEqual({ email: 'must be an e-mail address' });
  });

  it('limits requests per address, with the same 429 whether or not it has an account', async () => {
    const statuses = async (email: string) => {
      const codes: number[] = [];
      for (let attempt = 0; attempt < 4; attempt += 1) codes.push((await requestReset(email)).status);
      return codes;
    };
    expect(await statuses('lead@kcatalog.example')).toEqual([202, 202, 202, 429]);
    expect(await statuses('ghost@kcatalog.example')).toEqual([202, 202, 202, 429]);
    const limited = await requestReset('ghost@kcatalog.example');
    expect(limited.body.error.code).toBe('rate_limited');
  });
});

describe('resetting a password, end to end through the fake SMTP server', () => {
  it('sets the new password from the link, ends every session of the user and signs in on this one', async () => {
    const other = await signedIn(testApp.app, demoEmail('kineticist'));
    await other.agent.get('/api/auth/me').expect(200);
    const path = await resetLink(demoEmail('kineticist'));

    const visitor = await client(testApp.app);
    const lookup = await visitor.agent.get(`/api/password-resets/lookup?token=${tokenOf(path)}`).expect(200);
    expect(lookup.body.reset.email).toBe(demoEmail('kineticist'));

    const { visitor: resetter, response } = await complete(path, 'a-brand-new-password');
    expect(response.status).toBe(200);
    expect(response.body.user.email).toBe(demoEmail('kineticist'));
    await resetter.agent.get('/api/auth/me').expect(200);
    await other.agent.get('/api/auth/me').expect(401);
    expect(await canSignIn(demoEmail('kineticist'), 'kcatalog-demo')).toBe(false);
    expect(await canSignIn(demoEmail('kineticist'), 'a-brand-new-password')).toBe(true);
  });

  it('refuses a used link', async () => {
    const path = await resetLink(demoEmail('admin'));
    expect((await complete(path, 'first-new-password')).response.status).toBe(200);
    const again = await complete(path, 'second-new-password');
    expect(again.response.status).toBe(400);
    expect(again.response.body.error).toMatchObject({ code: 'invalid_token', fields: { token: 'was already used' } });
    expect(await canSignIn(demoEmail('admin'), 'first-new-password')).toBe(true);
  });

  it('refuses an expired link and keeps the password', async () => {
    await testApp.dataSource.query(`DELETE FROM password_resets`);
    const path = await resetLink('Biologist@kcatalog.example');
    await testApp.dataSource.query(`UPDATE password_resets SET expires_at = '2020-01-01 00:00:00.000'`);
    const visitor = await client(testApp.app);
    expect((await visitor.agent.get(`/api/password-resets/lookup?token=${tokenOf(path)}`).expect(400)).body.error.fields).toEqual({ token: 'has expired' });
    const { response } = await complete(path, 'never-applied-password');
    expect(response.status).toBe(400);
    expect(response.body.error.fields).toEqual({ token: 'has expired' });
    expect(await canSignIn(demoEmail('biologist'), 'kcatalog-demo')).toBe(true);
  });

  it('makes every other open link of the account void once one is used', async () => {
    await testApp.dataSource.query(`DELETE FROM password_resets`);
    const [first, second] = [await resetLink(demoEmail('viewer')), await resetLink(demoEmail('viewer'))];
    expect((await complete(second, 'viewer-new-password')).response.status).toBe(200);
    expect((await complete(first, 'viewer-other-password')).response.body.error.fields).toEqual({ token: 'was already used' });
    expect(await testApp.dataSource.getRepository(PasswordReset).countBy({ usedAt: Not(IsNull()) })).toBe(2);
  });

  it('answers 400 with field messages for a malformed token or a short password, changing nothing', async () => {
    const visitor = await client(testApp.app);
    const response = await visitor.agent.post('/api/password-resets/complete').set('X-CSRF-Token', visitor.csrfToken).send({ token: 'x', newPassword: 'short' }).expect(400);
    expect(response.body.error.fields).toEqual({ token: 'is not a valid link; copy the whole link from the e-mail', newPassword: 'must be at least 10 characters' });
    const unknown = await visitor.agent.post('/api/password-resets/complete').set('X-CSRF-Token', visitor.csrfToken).send({ token: 'B'.repeat(43), newPassword: 'long-enough-password' }).expect(400);
    expect(unknown.body.error.fields).toEqual({ token: 'is not a valid reset link' });
  });
});
