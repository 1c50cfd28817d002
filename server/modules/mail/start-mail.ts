import type { DataSource } from 'typeorm';
import type { Env } from '../../env';
import { startFakeSmtpServer, type FakeSmtpServer } from './fake-smtp-server';
import { MailDelivery } from './mail-delivery';
import type { MailOptions } from './mail-options';

/** Mail as a running server has it: the options for the app and the scheduler, and how to stop it. */
export interface RunningMail {
  options: MailOptions;
  fakeServer: FakeSmtpServer | null;
  /** A line for the start-up log. */
  description: string;
  close: () => Promise<void>;
}

/**
 * Starts mail for a server: with KCATALOG_SMTP_URL a delivery worker for that server; without it the
 * local fake SMTP server (on KCATALOG_FAKE_SMTP_PORT, or a free port if that one is taken) and a worker
 * that delivers to it.
 *
 * @param dataSource the data source
 * @param env the parsed environment
 * @returns the running mail
 */
export async function startMail(dataSource: DataSource, env: Env): Promise<RunningMail> {
  const fakeServer = env.KCATALOG_SMTP_URL
    ? null
    : await startFakeSmtpServer(dataSource, { port: env.KCATALOG_FAKE_SMTP_PORT, fallbackToFreePort: true });
  const delivery = new MailDelivery(dataSource, {
    target: fakeServer ? { kind: 'fake', host: fakeServer.host, port: fakeServer.port } : { kind: 'smtp', url: env.KCATALOG_SMTP_URL ?? '' },
  });
  await delivery.start();
  return {
    options: {
      publicUrl: env.publicUrl,
      from: env.KCATALOG_MAIL_FROM,
      timezone: env.KCATALOG_TIMEZONE,
      digestSchedule: { day: env.KCATALOG_DIGEST_DAY, hour: env.KCATALOG_DIGEST_HOUR },
      delivery,
    },
    fakeServer,
    description: fakeServer
      ? `Mail: local fake SMTP server on ${fakeServer.host}:${fakeServer.port} (messages on the Outbox page, nothing is delivered)`
      : `Mail: SMTP ${redactedUrl(env.KCATALOG_SMTP_URL ?? '')}`,
    close: async () => {
      await delivery.close();
      await fakeServer?.close();
    },
  };
}

function redactedUrl(value: string): string {
  const url = new URL(value);
  if (url.password) url.password = '***';
  return url.toString();
}
