import { SMTPServer } from 'smtp-server';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { writeTransaction } from '@server/write-transaction';
import { enqueueMail } from '@server/modules/mail/enqueue-mail';
import { startFakeSmtpServer, type FakeSmtpServer } from '@server/modules/mail/fake-smtp-server';
import { MailDelivery } from '@server/modules/mail/mail-delivery';
import { OutboxMessage } from '@server/modules/mail/outbox-message.entity';
import { escapeHtml } from '@server/modules/mail/escape-html';
import { createMailTestApp, receivedFor, waitFor, waitForMessages, type MailTestApp } from './mail-test-app';
import { removeDataDir } from './test-app';
import { signInEveryRole } from './role-sessions';
import { freePort } from '../free-port';

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

async function queue(to: string, subject: string): Promise<OutboxMessage> {
  return writeTransaction(testApp.dataSource, (manager) =>
    enqueueMail(manager, { kind: 'invitation', to, toName: 'Invented Person', from: 'Kcatalog <kcatalog@localhost>', subject, text: 'Plain part', html: '<p>HTML part</p>', headers: { 'X-Test': 'yes' } }),
  );
}

async function outboxRow(id: number): Promise<OutboxMessage> {
  return testApp.dataSource.getRepository(OutboxMessage).findOneByOrFail({ id });
}

describe('the local fake SMTP server', () => {
  it('receives a message over SMTP, parses it and keeps both parts and the headers', async () => {
    const queued = await queue('reader@kcatalog.example', 'Über den Test – ΔΔG‡');
    testApp.delivery.kick();
    const [received] = await waitForMessages(testApp.dataSource, 'reader@kcatalog.example');
    expect(received.subject).toBe('Über den Test – ΔΔG‡');
    expect(received.text.trim()).toBe('Plain part');
    expect(received.html).toContain('<p>HTML part</p>');
    expect(received.messageId).toBe(queued.messageId);
    expect(received.headers).toContainEqual({ name: 'X-Test', value: 'yes' });
    expect(received.toHeader).toContain('Invented Person');
    const row = await waitFor(async () => ((await outboxRow(queued.id)).status === 'sent' ? outboxRow(queued.id) : null), 'the send log entry');
    expect(row.attempts).toBe(1);
    expect(row.smtpResponse).toMatch(/^250/);
  });
});

describe('delivery with retries', () => {
  let workers: MailDelivery[] = [];
  let servers: { close: () => Promise<void> }[] = [];
  // Each test runs its own worker against its own server; the app's worker would pick up their messages too.
  beforeAll(() => testApp.delivery.close());
  // Workers first: an SMTP server's close waits for the pooled connections a worker still holds.
  afterEach(async () => {
    for (const worker of workers) await worker.close();
    for (const server of servers) await server.close();
    workers = [];
    servers = [];
  });

  it('retries while the SMTP server is down and delivers exactly once when it is back', async () => {
    const port = await freePort();
    const delivery = new MailDelivery(testApp.dataSource, { target: { kind: 'fake', host: '127.0.0.1', port }, retryDelaysMs: [100, 150, 200, 300, 400, 500, 600], pollIntervalMs: 200 });
    workers.push(delivery);
    const queued = await queue('retry@kcatalog.example', 'Down then up');
    delivery.kick();

    const failing = await waitFor(async () => {
      const row = await outboxRow(queued.id);
      return row.attempts >= 2 ? row : null;
    }, 'two failed attempts');
    expect(failing.status).not.toBe('sent');
    expect(failing.lastError).toMatch(/ECONNREFUSED/);
    expect(await receivedFor(testApp.dataSource, 'retry@kcatalog.example')).toHaveLength(0);

    const revived: FakeSmtpServer = await startFakeSmtpServer(testApp.dataSource, { port });
    servers.push(revived);
    const sent = await waitFor(async () => {
      const row = await outboxRow(queued.id);
      return row.status === 'sent' ? row : null;
    }, 'delivery after the server came back');
    expect(sent.attempts).toBeGreaterThanOrEqual(3);
    expect(sent.lastError).toBeNull();
    await delivery.idle();
    await new Promise((done) => setTimeout(done, 300));
    const received = await receivedFor(testApp.dataSource, 'retry@kcatalog.example');
    expect(received).toHaveLength(1);
    expect(received[0].messageId).toBe(queued.messageId);
  });

  it('records the error and stops after the last retry', async () => {
    const port = await freePort();
    const delivery = new MailDelivery(testApp.dataSource, { target: { kind: 'fake', host: '127.0.0.1', port }, retryDelaysMs: [20, 20] });
    workers.push(delivery);
    const queued = await queue('never@kcatalog.example', 'Never arrives');
    delivery.kick();
    const failed = await waitFor(async () => ((await outboxRow(queued.id)).status === 'failed' ? outboxRow(queued.id) : null), 'the failure');
    expect(failed.attempts).toBe(3);
    expect(failed.lastError).toMatch(/ECONNREFUSED/);
    expect(failed.nextAttemptAt).toBeNull();
  });

  it('does not retry a permanent refusal (5xx) and keeps the server’s reply', async () => {
    const refusing = new SMTPServer({
      authOptional: true,
      disabledCommands: ['AUTH', 'STARTTLS'],
      logger: false,
      onRcptTo(_address, _session, callback) {
        callback(Object.assign(new Error('Mailbox unavailable'), { responseCode: 550 }));
      },
    });
    await new Promise<void>((done) => refusing.listen(0, '127.0.0.1', done));
    const address = refusing.server.address();
    const port = typeof address === 'object' && address ? address.port : 0;
    servers.push({ close: () => new Promise<void>((done) => refusing.close(() => done())) });
    const delivery = new MailDelivery(testApp.dataSource, { target: { kind: 'fake', host: '127.0.0.1', port }, retryDelaysMs: [20, 20, 20] });
    workers.push(delivery);
    const queued = await queue('refused@kcatalog.example', 'Refused');
    delivery.kick();
    const failed = await waitFor(async () => ((await outboxRow(queued.id)).status === 'failed' ? outboxRow(queued.id) : null), 'the refusal');
    expect(failed.attempts).toBe(1);
    expect(failed.lastError).toMatch(/550|Mailbox unavailable/);
  });

  it('puts a message a crash left "sending" back in the queue on start', async () => {
    const queued = await queue('crashed@kcatalog.example', 'Interrupted');
    await testApp.dataSource.query(`UPDATE outbox_messages SET status = 'sending' WHERE id = ?`, [queued.id]);
    const delivery = new MailDelivery(testApp.dataSource, { target: { kind: 'fake', host: testApp.fake.host, port: testApp.fake.port } });
    workers.push(delivery);
    await delivery.start();
    await waitForMessages(testApp.dataSource, 'crashed@kcatalog.example');
    // The fake server stores a message before it answers; the worker records the answer just after.
    await waitFor(async () => (await outboxRow(queued.id)).status === 'sent', 'the send log entry');
    expect(await receivedFor(testApp.dataSource, 'crashed@kcatalog.example')).toHaveLength(1);
  });
});

describe('GET /api/outbox', () => {
  it('returns 401 signed out and 403 for every role but admin', async () => {
    const { client } = await import('./test-app');
    const anonymous = await client(testApp.app);
    await anonymous.agent.get('/api/outbox').expect(401);
    for (const role of ['lead', 'kineticist', 'biologist', 'viewer'] as const) {
      await roles.as(role).get('/api/outbox').expect(403);
      await roles.as(role).get('/api/outbox/received').expect(403);
      await roles.as(role).get('/api/outbox/messages').expect(403);
    }
  });

  it('reports the fake mode with its port and counts', async () => {
    const { body } = await roles.as('admin').get('/api/outbox').expect(200);
    expect(body.mode).toBe('fake');
    expect(body.fakeServer).toEqual({ host: '127.0.0.1', port: testApp.fake.port });
    expect(body.counts.sent).toBeGreaterThanOrEqual(1);
    expect(body.received).toBeGreaterThanOrEqual(1);
  });

  it('lists received messages newest first and shows one with its parts and headers', async () => {
    const list = await roles.as('admin').get('/api/outbox/received?pageSize=2').expect(200);
    expect(list.body.rows.length).toBeLessThanOrEqual(2);
    expect(list.body.total).toBeGreaterThanOrEqual(1);
    const ids = list.body.rows.map((row: { id: number }) => row.id);
    expect([...ids].sort((a: number, b: number) => b - a)).toEqual(ids);
    const { body } = await roles.as('admin').get(`/api/outbox/received/${ids[0]}`).expect(200);
    expect(body.message).toMatchObject({ id: ids[0] });
    expect(typeof body.message.text).toBe('string');
    expect(Array.isArray(body.message.headers)).toBe(true);
  });

  it('lists the send log with filters and shows one entry with what was sent', async () => {
    const failed = await roles.as('admin').get('/api/outbox/messages?status=failed').expect(200);
    expect(failed.body.rows.length).toBeGreaterThanOrEqual(2);
    expect(failed.body.rows.every((row: { status: string; lastError: string | null }) => row.status === 'failed' && row.lastError)).toBe(true);
    const { body } = await roles.as('admin').get(`/api/outbox/messages/${failed.body.rows[0].id}`).expect(200);
    expect(body.message.html).toBe('<p>HTML part</p>');
    expect(body.message.headers).toEqual({ 'X-Test': 'yes' });
  });

  it('answers 400 with field messages for a bad filter or page, and 404 for an unknown message', async () => {
    const status = await roles.as('admin').get('/api/outbox/messages?status=lost').expect(400);
    expect(status.body.error.fields.status).toMatch(/queued, sending, sent, failed/);
    const page = await roles.as('admin').get('/api/outbox/received?pageSize=1000').expect(400);
    expect(page.body.error.fields.pageSize).toMatch(/1 to 200/);
    await roles.as('admin').get('/api/outbox/received/999999').expect(404);
    await roles.as('admin').get('/api/outbox/messages/abc').expect(400);
  });
});

describe('escapeHtml', () => {
  // OWASP XSS Prevention Cheat Sheet, rule 1: & < > " ' become entities.
  it('turns markup into text', () => {
    expect(escapeHtml(`<script>alert("x")</script> & 'y'`)).toBe('&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; &#39;y&#39;');
  });
});
