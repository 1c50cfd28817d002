import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Express } from 'express';
import type { DataSource } from 'typeorm';
import { createApp } from '@server/app';
import { openDatabase } from '@server/data-source';
import { startFakeSmtpServer, type FakeSmtpServer } from '@server/modules/mail/fake-smtp-server';
import { MailDelivery } from '@server/modules/mail/mail-delivery';
import { resolveMailOptions, type MailOptions } from '@server/modules/mail/mail-options';
import { ReceivedMessage } from '@server/modules/mail/received-message.entity';
import type { DatabaseSessionStore } from '@server/modules/sessions/database-session-store';
import { seedDemoAccounts } from '@server/seed/demo-accounts';
import { testSecret } from './test-app';

/** The base of links in test mail; nothing listens there, tests follow the paths through supertest. */
export const testPublicUrl = 'http://kcatalog.test';

export interface MailTestApp {
  app: Express;
  dataSource: DataSource;
  dataDir: string;
  fake: FakeSmtpServer;
  delivery: MailDelivery;
  mail: MailOptions;
  close: () => Promise<void>;
}

/**
 * An app as index.ts builds it, on a temporary (or given) data folder: a real local fake SMTP server on a
 * free port and a delivery worker with short retry waits, so every message travels over SMTP.
 */
export async function createMailTestApp(
  options: { dataDir?: string; retryDelaysMs?: number[]; mail?: Partial<MailOptions> } = {},
): Promise<MailTestApp> {
  const dataDir = options.dataDir ?? mkdtempSync(join(tmpdir(), 'kcatalog-mail-test-'));
  const dataSource = await openDatabase({ database: join(dataDir, 'kcatalog.sqlite') });
  if ((await dataSource.query('SELECT COUNT(*) AS n FROM users'))[0].n === 0) await seedDemoAccounts(dataSource);
  const fake = await startFakeSmtpServer(dataSource, { port: 0 });
  const delivery = new MailDelivery(dataSource, {
    target: { kind: 'fake', host: fake.host, port: fake.port },
    retryDelaysMs: options.retryDelaysMs ?? [50, 100, 200],
    pollIntervalMs: 500,
  });
  await delivery.start();
  const mail = resolveMailOptions({ publicUrl: testPublicUrl, ...options.mail, delivery });
  const app = createApp(dataSource, { sessionSecret: testSecret, mail });
  return {
    app,
    dataSource,
    dataDir,
    fake,
    delivery,
    mail,
    close: async () => {
      (app.locals.sessionStore as DatabaseSessionStore).close();
      await delivery.close();
      await fake.close();
      await dataSource.destroy();
    },
  };
}

/** Polls until `check` returns something truthy, or fails after `timeoutMs`. */
export async function waitFor<T>(check: () => Promise<T | null | undefined | false>, what: string, timeoutMs = 10_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await check();
    if (value) return value;
    if (Date.now() > deadline) throw new Error(`Timed out waiting for ${what}`);
    await new Promise((done) => setTimeout(done, 25));
  }
}

/** Messages the fake SMTP server received for an address, oldest first. */
export async function receivedFor(dataSource: DataSource, address: string): Promise<ReceivedMessage[]> {
  const messages = await dataSource.getRepository(ReceivedMessage).find({ order: { id: 'ASC' } });
  return messages.filter((message) => message.envelopeTo.some((recipient) => recipient.toLowerCase() === address.toLowerCase()));
}

/** Waits until the fake server has received `count` messages for an address, and returns them. */
export function waitForMessages(dataSource: DataSource, address: string, count = 1): Promise<ReceivedMessage[]> {
  return waitFor(async () => {
    const messages = await receivedFor(dataSource, address);
    return messages.length >= count ? messages : null;
  }, `${count} message(s) to ${address}`);
}

/** The path and query of the first link in a message's text that starts with the public URL and `path`. */
export function linkPath(text: string, path: string): string {
  const match = new RegExp(`${testPublicUrl.replace(/[.]/g, '\\.')}(${path.replace(/[/]/g, '\\/')}\\?token=[A-Za-z0-9_-]+)`).exec(text);
  if (!match) throw new Error(`No ${path} link in:\n${text}`);
  return match[1];
}

/** The token of a link path such as `/invitation?token=…`. */
export function tokenOf(path: string): string {
  return new URL(path, testPublicUrl).searchParams.get('token') ?? '';
}
